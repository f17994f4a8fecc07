/**
 * The safety caution of DESIGN.md. Rendered statically by SafetyCaution.astro, and live on
 * Compare (where the input range changes as the user types).
 */
export default function SafetyCautionText({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      role="note" aria-label="Safety caution" data-safety-caution
      className={`rounded-md border border-warn/40 bg-warn-soft text-sm text-ink ${compact ? 'px-3 py-2' : 'px-4 py-3'}`}
    >
      <p>
        <strong className="text-warn">Caution — hazardous voltages.</strong> Off-line forward converters run from rectified mains
        and PFC buses at hundreds of volts. Isolation and creepage/clearance must follow the applicable safety standard (for
        example IEC 62368-1). Figures here are estimates for early trade-off only; a final design needs verification by qualified
        engineers and compliance with local codes.
      </p>
    </aside>
  );
}
