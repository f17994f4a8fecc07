/** Where a scratch comparison starts: a plain 48 V bus to 12 V, 100 W stage at 200 kHz. */
export const STARTING_REQUIREMENTS: Record<string, unknown> = {
  vinMinV: 36,
  vinNomV: 48,
  vinMaxV: 60,
  voutV: 12,
  ioutA: 8.5,
  fswHz: 200e3,
  annualVolume: 1000,
  rectifier: 'diode',
};
