import { useStore } from '@nanostores/react';
import { SCHEME_LABELS, type SchemeId } from '../../engine/scheme-ids';
import { formatSi } from '../../lib/si';
import { $sweepHandoff } from '../../stores/sweep-handoff';

/** On Compare: which sweep point was applied (scheme and values), and a way back to the saved set. */
export default function SweepHandoffNote() {
  const { applied, error } = useStore($sweepHandoff);
  const clear = (): void => window.location.assign(window.location.pathname);
  if (error) {
    return (
      <p className="card mb-4 border-fail/40 bg-fail-soft px-3 py-2 text-sm text-fail" role="alert" data-sweep-handoff-error>
        {error} <button type="button" className="ml-2 underline" onClick={clear}>Open the saved set</button>
      </p>
    );
  }
  if (!applied) return null;
  return (
    <div className="card mb-4 flex flex-wrap items-start justify-between gap-2 bg-accent-soft px-3 py-2 text-sm" role="status" data-sweep-handoff>
      <div>
        <p className="font-semibold">Design point from Sweep</p>
        <ul className="mt-0.5 space-y-0.5">
          {Object.entries(applied.overrides).map(([scheme, o]) => (
            <li key={scheme}>
              <span className="font-medium">{SCHEME_LABELS[scheme as SchemeId]}</span>:{' '}
              {[
                o.dutyLimit !== undefined && `duty limit ${o.dutyLimit.toFixed(3)}`,
                o.turnsRatio !== undefined && `turns ratio Ns/Np ${o.turnsRatio.toFixed(3)}`,
                o.partIds?.mainSwitch && `main switch ${o.partIds.mainSwitch}`,
                o.partIds?.rectifier && `rectifier ${o.partIds.rectifier}`,
                o.partIds?.core && `core ${o.partIds.core}`,
              ].filter(Boolean).join(' · ') || 'engine defaults'}
            </li>
          ))}
          {applied.fswHz !== null && <li>Switching frequency {formatSi(applied.fswHz, 'Hz')} (form)</li>}
        </ul>
        <p className="mt-0.5 text-xs text-muted">Applied to this comparison as unsaved changes: save to keep it as the set's next version (architects and admins), or clear it. SPICE netlists refer to the saved version.</p>
      </div>
      <button type="button" className="btn" onClick={clear} data-clear-sweep-point>Clear sweep point</button>
    </div>
  );
}
