import type { GateItem } from './types'

// The usual bench cautions, in plain words. Every gate ends with LOCAL_CODES.
export const GATE = {
  plugControl: { id: 'plug-control', text: 'The mains plug is out and stays in my sight and control until a step says to power up.' },
  storedCharge: { id: 'stored-charge', text: 'Filter capacitors can hold a lethal charge after the amp is unplugged. I drain them and verify with a meter before touching anything inside.' },
  oneHand: { id: 'one-hand', text: 'With power on I work one-handed where I can, the other hand away from the chassis, and clip leads on with the amp off.' },
  ratedMeter: { id: 'rated-meter', text: 'My meter and its leads are rated above the highest voltage in this amp (B+ is often 300–500 V DC).' },
  loadConnected: { id: 'load-connected', text: 'A speaker or dummy load of the right impedance is connected before power-up. I never run the output stage without a load.' },
  noJewellery: { id: 'no-jewellery', text: 'Rings, watches and bracelets are off; sleeves and hair are clear of the chassis.' },
  hotParts: { id: 'hot-parts', text: 'Tubes and power resistors get hot enough to burn; I let them cool before handling.' },
  neverOpen: { id: 'never-open', text: 'I do not open the chassis or reach inside it: the capacitors inside hold a lethal charge even when the amp is unplugged.' },
  unplugFirst: { id: 'unplug-first', text: 'I unplug the amp before changing a fuse or a tube, and fit only the fuse value and type printed on the amp.' },
  localCodes: { id: 'local-codes', text: 'I follow local electrical codes and licensed practice; where they say something different from this app, they win.' },
} as const satisfies Record<string, GateItem>
