import type { Comparison, NormalisedSpec, SchemeResult } from '../../engine';
import { formatCount, formatMoney, formatPercent, formatSi, formatSiRange } from '../../lib/format';
import type { BriefLine } from '../../schemas/brief-content';
import { plainReason } from './reasons';


/** The requirement set in the customer's terms, with units ("36–75 V, nominal 48 V"). */
export function requirementLines(s: NormalisedSpec, currency: string): BriefLine[] {
  const lines: BriefLine[] = [
    { label: 'Input voltage', value: `${formatSiRange(s.vinMinV, s.vinMaxV, 'V')} DC, nominal ${formatSi(s.vinNomV, 'V')}` },
    { label: 'Output', value: `${formatSi(s.voutV, 'V')} at ${formatSi(s.ioutA, 'A')} (${formatSi(s.voutV * s.ioutA, 'W')})` },
    { label: 'Switching frequency', value: formatSi(s.fswHz, 'Hz') },
    { label: 'Output ripple', value: `${formatSi(s.voutRippleV, 'V')} peak-to-peak` },
    { label: 'Output rectifier', value: s.rectifier === 'synchronous' ? 'synchronous (MOSFETs)' : 'diodes' },
    { label: 'Ambient temperature', value: `${s.ambientC} °C` },
    { label: 'Annual volume', value: `${formatCount(s.annualVolume)} units/year` },
  ];
  if (s.targetEfficiency !== null) lines.push({ label: 'Efficiency target', value: `${formatPercent(s.targetEfficiency)} at ${formatSi(s.vinNomV, 'V')}, full load` });
  if (s.targetUnitCost !== null) lines.push({ label: 'Power-stage cost target', value: `${formatMoney(s.targetUnitCost, currency)} per unit` });
  return lines;
}

const pct1 = (x: number): string => (x * 100).toFixed(1);

/** The recommended scheme's key figures, each with its unit. */
export function keyFigures(r: SchemeResult, s: NormalisedSpec): BriefLine[] {
  const lines: BriefLine[] = [
    { label: 'Primary switch rating', value: r.switchRatingV === null ? 'none in the library fits' : `${r.switchRatingV.toFixed(0)} V${r.switchCount > 1 ? ` (${r.switchCount} switches)` : ''}` },
    { label: 'Worst-case switch stress', value: formatSi(r.switchStressV, 'V') },
    { label: `Duty at ${formatSi(s.vinMinV, 'V')} / ${formatSi(s.vinNomV, 'V')} / ${formatSi(s.vinMaxV, 'V')}`, value: `${pct1(r.duty.atVinMin)} / ${pct1(r.duty.atVinNom)} / ${pct1(r.duty.atVinMax)} %` },
    { label: 'Transformer turns ratio Ns/Np', value: r.turnsRatio.toPrecision(3) },
    { label: `Efficiency at ${formatSi(s.vinNomV, 'V')}, full load`, value: formatPercent(r.efficiency) },
    { label: 'Power-stage losses at full load', value: formatSi(r.lossesW.total, 'W') },
    { label: 'Rectifier reverse voltage (forward / freewheel)', value: `${formatSi(r.rectifierReverseV.forward, 'V')} / ${formatSi(r.rectifierReverseV.freewheel, 'V')}` },
    { label: 'Output inductor / capacitor', value: `${formatSi(r.outputInductanceH, 'H', 2)} / ${formatSi(r.outputCapacitanceF, 'F', 2)}` },
    { label: 'Power-stage part count', value: `${r.partCount}` },
    { label: `Power-stage BOM at ${formatCount(s.annualVolume)} units/year`, value: formatMoney(r.bomCost, r.currency) },
  ];
  if (r.clampCapacitorV !== null) lines.splice(2, 0, { label: 'Clamp voltage', value: formatSi(r.clampCapacitorV, 'V') });
  return lines;
}

const userLines = (text: string): string[] => text.split('\n').map((l) => l.trim().replace(/^[-•*]\s*/, '')).filter(Boolean);

/** Lead risks: the recommended scheme's warnings, then its notes, then the author's own lines. */
export function riskLines(r: SchemeResult | undefined, extra: string): string[] {
  const fromEngine = r ? [...r.findings.filter((f) => f.severity === 'warn'), ...r.findings.filter((f) => f.severity === 'info')].map(plainReason) : [];
  return [...fromEngine, ...userLines(extra)];
}

/** What the estimate rests on, then the author's own lines. */
export function assumptionLines(c: Comparison, extra: string): string[] {
  const s = c.input;
  return [
    `Semiconductor voltage ratings are used up to ${formatPercent(s.voltageDerating)} (derating); ambient ${s.ambientC} °C.`,
    `The controller limits duty to ${formatPercent(s.maxDuty)}; inductor ripple is ${formatPercent(s.rippleRatio)} of full-load current.`,
    `Parts and prices come from the parts library "${c.partsLibrary.name}" (version ${c.partsLibrary.version}) at the price tier for ${formatCount(s.annualVolume)} units/year${c.partsLibrary.demo ? '; its parts and prices are invented for the demo' : ''}.`,
    'Only the power stage is estimated: control, protection, EMI filter, auxiliary supply, board, housing, assembly, test and margin are not included.',
    `Figures from the Resetwise engine, version ${c.engineVersion}: idealised models for early trade-off, not a verified design.`,
    ...userLines(extra),
  ];
}
