/**
 * Command-line evaluation: `npm run --silent evaluate -- FILE.json` (or `-` for stdin).
 * Options: --scheme ID (repeatable), --csv (one row per scheme), --parts FILE (another library).
 * Bad input: exit code 2, one line per problem on stderr, nothing on stdout.
 */
import { readFileSync } from 'node:fs';
import { evaluateNormalised, parseSpecInput, SCHEME_IDS, type Comparison, type PartsLibrary } from '../src/engine/index';

function fail(lines: string[]): never {
  process.stderr.write(lines.map((l) => `${l}\n`).join(''));
  process.exit(2);
}

function readJson(path: string, what: string): unknown {
  let text: string;
  try {
    text = path === '-' ? readFileSync(0, 'utf8') : readFileSync(path, 'utf8');
  } catch (e) {
    fail([`${what}: cannot read ${path === '-' ? 'stdin' : path} (${(e as NodeJS.ErrnoException).code ?? 'error'})`]);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    fail([`${what}: not valid JSON (${(e as Error).message})`]);
  }
}

const LIBRARY_LISTS = ['mosfets', 'srMosfets', 'rectifiers', 'clampDiodes', 'gateDrivers', 'cores', 'capacitors', 'resistors', 'inductors'] as const;

function checkLibrary(raw: unknown): PartsLibrary {
  if (raw === null || typeof raw !== 'object') fail(['parts: the library must be a JSON object']);
  const lib = raw as Record<string, unknown>;
  const problems: string[] = [];
  for (const key of ['name', 'version', 'currency']) if (typeof lib[key] !== 'string') problems.push(`parts.${key} must be a string`);
  for (const key of LIBRARY_LISTS) if (!Array.isArray(lib[key])) problems.push(`parts.${key} must be a list`);
  // A library written before windings were costed has no winding list: it evaluates with uncosted windings (a finding says so).
  if (lib.windings !== undefined && !Array.isArray(lib.windings)) problems.push('parts.windings must be a list');
  if (problems.length > 0) fail(problems);
  return { ...(raw as PartsLibrary), windings: (lib.windings as PartsLibrary['windings'] | undefined) ?? [] };
}

function csv(c: Comparison): string {
  const head = ['scheme', 'feasible', 'turnsRatio', 'dutyLimit', 'dutyAtVinMin', 'dutyAtVinNom', 'dutyAtVinMax', 'switchCount',
    'switchPeakV', 'switchStressV', 'switchRatingV', 'rectifierForwardV', 'rectifierFreewheelV', 'clampCapacitorV',
    'magnetizingPeakA', 'primaryRmsA', 'outputInductanceH', 'outputCapacitanceF', 'corePartId', 'turnsPrimary', 'deltaBT',
    'coreLossW', 'lossTotalW', 'efficiency', 'partCount', 'bomCost', 'score', 'failCodes'];
  const cell = (v: unknown): string => {
    const s = v === null || v === undefined ? '' : typeof v === 'number' ? String(+v.toPrecision(6)) : String(v);
    return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  const rows = c.results.map((r) => [r.scheme, r.feasible, r.turnsRatio, r.dutyLimit, r.duty.atVinMin, r.duty.atVinNom, r.duty.atVinMax,
    r.switchCount, r.switchPeakV, r.switchStressV, r.switchRatingV, r.rectifierReverseV.forward, r.rectifierReverseV.freewheel,
    r.clampCapacitorV, r.magnetizingPeakA, r.primaryRmsA, r.outputInductanceH, r.outputCapacitanceF, r.core.partId,
    r.core.turnsPrimary, r.core.deltaBT, r.core.coreLossW, r.lossesW.total, r.efficiency, r.partCount, r.bomCost, r.score,
    r.findings.filter((f) => f.severity === 'fail').map((f) => f.code).join(' ')].map(cell).join(','));
  return [head.join(','), ...rows].join('\n') + '\n';
}

function main(argv: string[]): void {
  let file: string | undefined;
  let asCsv = false;
  let partsFile: string | undefined;
  const schemes: string[] = [];
  for (let k = 0; k < argv.length; k++) {
    const a = argv[k]!;
    if (a === '--csv') asCsv = true;
    else if (a === '--scheme' || a === '--parts') {
      const v = argv[++k];
      if (v === undefined) fail([`${a} needs a value`]);
      if (a === '--scheme') schemes.push(v); else partsFile = v;
    } else if (a.startsWith('--')) fail([`unknown option ${a} (use --scheme ID, --csv, --parts FILE)`]);
    else if (file === undefined) file = a;
    else fail([`only one requirement-set file may be given (got ${file} and ${a})`]);
  }
  if (file === undefined) fail(['usage: evaluate FILE.json|- [--scheme ID]... [--csv] [--parts FILE]']);
  const unknown = schemes.filter((s) => !(SCHEME_IDS as readonly string[]).includes(s));
  if (unknown.length > 0) fail(unknown.map((s) => `--scheme ${s} is not a known scheme (known: ${SCHEME_IDS.join(', ')})`));
  const raw = readJson(file, 'input');
  if (schemes.length > 0 && raw !== null && typeof raw === 'object' && !Array.isArray(raw)) (raw as Record<string, unknown>).schemes = schemes;
  const parsed = parseSpecInput(raw);
  if (!parsed.ok) fail(parsed.errors.map((e) => e.message));
  const library = partsFile ? checkLibrary(readJson(partsFile, 'parts')) : undefined;
  const result = evaluateNormalised(parsed.value, library);
  process.stdout.write(asCsv ? csv(result) : `${JSON.stringify(result, null, 2)}\n`);
}

main(process.argv.slice(2));
