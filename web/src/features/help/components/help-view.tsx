import { SafetyCautionNote } from '@web/components/safety-caution-note';
import { GLOSSARY } from '@web/lib/glossary';

/** Every term the workspace explains, with its source, in one page that can be linked to by term. */
export function HelpView({ caution }: { caution?: string }) {
  return (
    <div className="max-w-3xl space-y-6">
      <section aria-labelledby="help-workspace">
        <h2 id="help-workspace" className="text-lg font-bold">
          The workspace
        </h2>
        <p className="mt-1 text-sm">
          The map shows the replay's belief (blue particles, mean and 95 % ellipse), what the robot believed
          at the time (orange) and the reference trajectory (green) at the cursor. The label in the map's
          corner names the step drawn; while another step loads it says so. Keys on the time slider: arrows
          one step, Shift+arrows one second, Home/End the ends, Space plays, [ and ] go to the previous or
          next flag, event or bookmark. "Copy link to this moment" gives an address that opens the same replay
          at the same time.
        </p>
      </section>
      <section aria-labelledby="help-terms">
        <h2 id="help-terms" className="text-lg font-bold">
          Terms
        </h2>
        <dl className="mt-2 space-y-4">
          {GLOSSARY.map((entry) => (
            <div key={entry.id} id={entry.id} className="scroll-mt-4">
              <dt className="font-bold">{entry.term}</dt>
              <dd className="text-sm">{entry.text}</dd>
              <dd className="text-xs text-ink-muted">Source: {entry.source}</dd>
            </div>
          ))}
        </dl>
      </section>
      {caution && <SafetyCautionNote text={caution} />}
    </div>
  );
}
