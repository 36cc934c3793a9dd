// The residual voltage the drain procedure and Cap drain treat as safe to touch, and where the
// figure comes from. No rule written for servicing tube amplifiers was found; the nearest published
// thresholds are cited, and local codes and licensed practice always win.

/**
 * Sources: OSHA 29 CFR 1910.333(a) (parts under 50 V to ground need not be de-energised) and NFPA
 * 70E (the same 50 V), read in secondary summaries. Conservative against IEC 61140:2016's
 * extra-low-voltage band (at most 120 V ripple-free d.c.) and IEC 62368-1's ES1 limit of 60 V d.c.
 * (the latter recalled from memory, the standard's text was not found).
 */
export const TOUCH_SAFE_VOLTS = 50

export const TOUCH_SAFE_WHY
  = `${TOUCH_SAFE_VOLTS} V is the US workplace threshold (OSHA 29 CFR 1910.333(a), and the same 50 V in NFPA 70E): `
    + 'below it a part need not be de-energised. It is conservative against IEC 61140\'s extra-low-voltage band '
    + '(up to 120 V ripple-free d.c.) and IEC 62368-1\'s 60 V d.c. '
    + 'No rule written for servicing tube amplifiers was found: local codes and licensed practice come first.'

export const TOUCH_SAFE_SHORT
  = `Touch nothing above ${TOUCH_SAFE_VOLTS} V: the US 50 V workplace threshold, below IEC 62368-1's 60 V and IEC 61140's 120 V d.c. Local codes come first.`

/**
 * Hold times in the drain procedure. None comes from a rule for tube amplifiers: common practice,
 * no source. For comparison only (different equipment): NEC 460.6 asks a capacitor's own discharge
 * device to bring it to 50 V within 1 minute; Cal/OSHA Title 8 §2893 waits 5 minutes, then shorts
 * and grounds it, and says the built-in device is no substitute.
 */
export const DRAIN_HOLD_MIN_SECONDS = 10
export const RECHECK_HOLD_SECONDS = 60
