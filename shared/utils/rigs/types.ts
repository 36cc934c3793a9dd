/** One socket of a rig and the tube type in it ("V5", "6L6GC"). */
export interface RigTube { position: string, type: string }

/** One reading of one position: idle plate current in mA, plate volts if taken, on a date (YYYY-MM-DD). */
export interface RigReading { on: string, position: string, mA: number, plateVolts: number | null }
