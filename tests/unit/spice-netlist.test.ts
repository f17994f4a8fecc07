import { describe, expect, test } from 'vitest';
import { demoPartsLibrary, ENGINE_VERSION, evaluateNormalised, parseSpecInput, SCHEME_IDS } from '../../src/engine';
import { buildNetlist, emissionFor, rectifierModel, spiceNumber } from '../../src/features/spice/netlist';
import { netlistPoint } from '../../src/features/spice/operating-point';

const parsed = parseSpecInput({ vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 12.5, fswHz: 250e3 });
if (!parsed.ok) throw new Error('spec');
const spec = parsed.value;
const comparison = evaluateNormalised(spec, demoPartsLibrary);
const ctx = { specName: 'Test brick', engineVersion: ENGINE_VERSION, libraryName: 'demo parts' };

describe('SPICE netlist text', () => {
  test.each(SCHEME_IDS)('%s: sources, switch, coupled windings, filter, load, .tran and the three measurements', (scheme) => {
    const result = comparison.results.find((r) => r.scheme === scheme)!;
    const p = netlistPoint(spec, result, 'min', demoPartsLibrary);
    const text = buildNetlist(p, ctx);
    expect(text.startsWith('* Resetwise SPICE netlist')).toBe(true);
    expect(text).toContain('Idealised models');
    expect(text).toMatch(/^VIN in 0 DC 3\.6e\+1$/m);
    expect(text).toMatch(/^VG1 g1 0 PULSE\(0 1 0 /m);
    expect(text).toMatch(/^\.model SWI SW\(/m);
    expect(text).toMatch(/^K1 LP LS 1$/m);
    expect(text).toMatch(/^LOUT sw lx /m);
    expect(text).toMatch(/^COUT out 0 /m);
    expect(text).toMatch(/^RLOAD out 0 9\.6e-1$/m); // 12 V / 12.5 A
    expect(text).toMatch(/^\.tran .* UIC$/m);
    for (const m of ['vsw_pk MAX v(d)', 'vout_avg AVG v(out)', 'il_max MAX i(VIL)', 'il_min MIN i(VIL)']) expect(text).toContain(`.meas tran ${m}`);
    expect(text.trimEnd().endsWith('.end')).toBe(true);
    // The engine's switch duty at this input (volt-seconds plus the leakage commutation time): PW + rise = D·T (derived).
    const pw = Number(/PULSE\(0 1 0 (\S+) \S+ (\S+) (\S+)\)/.exec(text)![2]);
    const tr = Number(/PULSE\(0 1 0 (\S+)/.exec(text)![1]);
    expect((pw + tr) * spec.fswHz).toBeCloseTo(result.duty.atVinMin, 5);
  });

  test.each([
    ['tertiary-winding', /^LLKR 0 rl .*\nK4 LLK LLKR 0\.99999\nLR rl rk .*\nK2 LP LR 1\nK3 LS LR 1\nDR rk in DIDEAL$/m],
    ['rcd-clamp', /^DCL d cl DIDEAL\nCCL cl in .* IC=.*\nRCL cl in /m],
    ['active-clamp', /^S2 d cc g2 0 SWI$/m],
    ['two-switch', /^DA d in DIDEAL\nDB 0 dt DIDEAL$/m],
    ['resonant-reset', /^CR d 0 \S+ IC=3\.6e\+1$/m],
  ] as const)('%s carries its own reset parts', (scheme, pattern) => {
    const result = comparison.results.find((r) => r.scheme === scheme)!;
    expect(buildNetlist(netlistPoint(spec, result, 'min', demoPartsLibrary), ctx)).toMatch(pattern);
  });

  test('a hazardous input or switch voltage adds the safety caution to the header', () => {
    const hv = parseSpecInput({ vinMinV: 300, vinNomV: 390, vinMaxV: 410, voutV: 12, ioutA: 20, fswHz: 130e3 });
    if (!hv.ok) throw new Error('spec');
    const r = evaluateNormalised(hv.value, demoPartsLibrary).results.find((x) => x.scheme === 'two-switch')!;
    expect(buildNetlist(netlistPoint(hv.value, r, 'max', demoPartsLibrary), ctx)).toContain('CAUTION: hazardous voltage');
    // 36 V input, two-switch: the switch sees the input only, so no caution; the tertiary winding at 75 V does.
    const twoSwitch = comparison.results.find((x) => x.scheme === 'two-switch')!;
    expect(buildNetlist(netlistPoint(spec, twoSwitch, 'min', demoPartsLibrary), ctx)).not.toContain('CAUTION');
    const tertiary = comparison.results.find((x) => x.scheme === 'tertiary-winding')!;
    expect(buildNetlist(netlistPoint(spec, tertiary, 'min', demoPartsLibrary), ctx)).toContain('CAUTION'); // 72 V on the switch
  });

  test('a scheme without a complete design gives a plain RangeError', () => {
    const r = { ...comparison.results[0]!, details: { ...comparison.results[0]!.details, magnetizingInductanceH: Number.NaN } };
    expect(() => netlistPoint(spec, r, 'min', demoPartsLibrary)).toThrow(/no complete design/);
  });

  test.each(SCHEME_IDS)('%s: the switch node carries the chosen switch’s Co(er) and the winding capacitance the engine lumps there; the magnetizing current is measured', (scheme) => {
    const result = comparison.results.find((r) => r.scheme === scheme)!;
    const p = netlistPoint(spec, result, 'max', demoPartsLibrary);
    const text = buildNetlist(p, ctx);
    const sw = demoPartsLibrary.mosfets.find((m) => m.id === result.details.mainSwitchId)!;
    expect(p.switchCapacitanceF).toBeCloseTo(sw.cossF * result.details.mainSwitchParallel, 18);
    if (scheme === 'two-switch') {
      expect(text).toContain(`CS1 in dt ${spiceNumber(p.switchCapacitanceF)}`);
      expect(text).toContain(`CS2 d 0 ${spiceNumber(p.switchCapacitanceF)}`);
      expect(text).toMatch(/^CW pa d 5e-11$/m);
    } else if (scheme === 'resonant-reset') {
      expect(text).toContain(`CR d 0 ${spiceNumber(result.details.resonantCapacitanceF!)}`);
    } else {
      expect(text).toContain(`CDN d 0 ${spiceNumber(p.switchCapacitanceF + 50e-12)}`);
    }
    // Every scheme draws the leakage (the resonant reset too, whose netlist used to leave it out).
    expect(text).toMatch(/^LLK (in|dt) pa /m);
    expect(text).toMatch(/^BIM im 0 V=i\(LP\)\+\S+\*i\(LS\)/m);
    expect(text).toContain('.meas tran im_max MAX v(im)');
    expect(p.expected.magnetizingPeakA).toBeGreaterThan(0);
  });

  test('the clamp switch is driven with a dead time at each edge (0.5 % of the period) inside the off time', () => {
    const result = comparison.results.find((r) => r.scheme === 'active-clamp')!;
    const text = buildNetlist(netlistPoint(spec, result, 'min', demoPartsLibrary), ctx);
    const [delay, rise, , width, period] = /^VG2 g2 0 PULSE\(0 1 (\S+) (\S+) (\S+) (\S+) (\S+)\)$/m.exec(text)!.slice(1).map(Number) as number[];
    const tOn = result.duty.atVinMin * period!;
    // Netlist numbers carry six significant digits: the edges are known to a millionth of the period.
    expect(Math.abs(delay! - tOn - 0.005 * period!)).toBeLessThan(1e-5 * period!);
    expect(Math.abs(period! - (delay! + rise! + width!) - 0.005 * period!)).toBeLessThan(1e-5 * period!);
  });

  test('diode models: the rectifier drops its full-load VF with 10 % in RS, and carries a small junction capacitance', () => {
    const m = /^\.model DRECT D\(IS=(\S+) N=(\S+) RS=(\S+) CJO=(\S+)\)$/.exec(rectifierModel(0.5, 10))!;
    const [is, n, rs] = m.slice(1, 4).map(Number) as [number, number, number];
    expect(n * 0.025865 * Math.log(10 / is) + 10 * rs).toBeCloseTo(0.5, 4);
    expect(10 * rs).toBeCloseTo(0.05, 12);
  });

  test('numbers and the diode drop model (Shockley: V = N·VT·ln(I/IS), derived)', () => {
    expect(spiceNumber(4.7e-6)).toBe('4.7e-6');
    expect(spiceNumber(250000)).toBe('2.5e+5');
    expect(() => spiceNumber(Number.NaN)).toThrow(RangeError);
    // N·VT·ln(1e12) = 0.5 V at full load for a 0.5 V drop.
    expect(emissionFor(0.5) * 0.025865 * Math.log(1e12)).toBeCloseTo(0.5, 12);
  });
});
