// A note, not an aside: a report page shows it up to three times, and landmarks of one name would crowd a screen
// reader's landmark list with copies.
export function SafetyNotice({ compact = false }: { compact?: boolean }) {
  return (
    <div
      role="note"
      aria-label="Safety"
      className={`border-l-4 border-copper bg-copper-wash/60 text-ink-soft ${compact ? "px-3 py-2 text-xs" : "px-4 py-3 text-sm"}`}
    >
      <strong className="font-semibold text-copper-deep">Mains and heat. </strong>
      The tests described here involve mains voltage, hot air above 400 °C and solder fumes. Use isolated, CAT-rated probes,
      never float an oscilloscope&apos;s ground, keep hot nozzles and tips on their stands and extract fumes. Follow your local
      electrical codes and leave work on fixed wiring to a licensed electrician.
    </div>
  );
}
