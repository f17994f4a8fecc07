/**
 * Voltage above which a screen, brief or netlist carries the hazardous-voltage caution: 60 V dc, the upper limit of
 * safety extra-low voltage (ES1 for dc in IEC 62368-1, from memory). One constant for every place that decides.
 */
export const HAZARDOUS_ABOVE_V = 60;

/** True where a voltage (input or switch node, V dc) calls for the safety caution. */
export function isHazardous(volts: number): boolean {
  return volts > HAZARDOUS_ABOVE_V;
}
