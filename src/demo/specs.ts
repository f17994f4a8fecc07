/**
 * Requirement sets of the demo workspace. Invented for Resetwise's fictional scenario
 * (Halvard Power Systems and its customers); no real product or customer stands behind them.
 * Values are SI units, in the field names of the evaluate contract.
 */
export interface DemoSpec {
  name: string;
  customer: string;
  requirements: {
    vinMinV: number;
    vinNomV: number;
    vinMaxV: number;
    voutV: number;
    ioutA: number;
    fswHz: number;
    annualVolume?: number;
    targetEfficiency?: number;
    targetUnitCost?: number;
    ambientC?: number;
    rectifier?: 'diode' | 'synchronous';
    voutRippleV?: number;
  };
}

export const demoSpecs: DemoSpec[] = [
  {
    name: 'Brick 36–75 V to 12 V, 150 W',
    customer: 'Nordlicht Telecom (fictional)',
    requirements: {
      vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 12.5, fswHz: 250e3,
      annualVolume: 20000, targetEfficiency: 0.92, targetUnitCost: 18, ambientC: 55,
      rectifier: 'synchronous', voutRippleV: 0.12,
    },
  },
  {
    name: '380 V bus to 12 V, 500 W, 10 ms hold-up',
    customer: 'Cobalt Ridge Datacenters (fictional)',
    requirements: {
      vinMinV: 300, vinNomV: 390, vinMaxV: 410, voutV: 12, ioutA: 41.7, fswHz: 130e3,
      annualVolume: 50000, targetEfficiency: 0.93, targetUnitCost: 28, ambientC: 50,
      rectifier: 'synchronous', voutRippleV: 0.12,
    },
  },
  {
    name: '24 V rail to 5 V, 50 W, DIN-rail',
    customer: 'Tessaro Automation (fictional)',
    requirements: {
      vinMinV: 18, vinNomV: 24, vinMaxV: 32, voutV: 5, ioutA: 10, fswHz: 200e3,
      annualVolume: 5000, targetEfficiency: 0.86, targetUnitCost: 9, ambientC: 60,
      rectifier: 'diode', voutRippleV: 0.05,
    },
  },
];
