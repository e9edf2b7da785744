import { Button } from '@web/components/button';
import { ImageDown } from 'lucide-react';
import { useState } from 'react';
import { makePicture, type Picture, type PictureSource } from '../lib/make-picture';
import type { PictureFormat, PictureSubject } from '../lib/picture-caption';
import { downloadBlob } from '../lib/rasterise-svg';

export interface PictureExportBarProps {
  /** Returns what the picture is made from, read when a button is pressed. */
  source: () => PictureSource | null;
  /** Saves a made picture to the case as a figure; answers what to tell the person. */
  onSave?: (picture: Picture) => Promise<string>;
}

const CHOICES: { subject: PictureSubject; format: PictureFormat; words: string }[] = [
  { subject: 'map', format: 'png', words: 'Map as PNG' },
  { subject: 'map', format: 'svg', words: 'Map as SVG' },
  { subject: 'timeline', format: 'png', words: 'Timeline as PNG' },
  { subject: 'timeline', format: 'svg', words: 'Timeline as SVG' },
];

/** "Export picture": the map or the timeline at the cursor, labelled with replay, digest and step. */
export function PictureExportBar({ source, onSave }: PictureExportBarProps) {
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState<string | null>(null);

  async function run(key: string, subject: PictureSubject, format: PictureFormat, save: boolean) {
    const from = source();
    if (!from) return;
    setProblem(null);
    setSaved(null);
    setBusy(key);
    try {
      const picture = await makePicture(from, subject, format);
      if (save && onSave) setSaved(await onSave(picture));
      else downloadBlob(picture.blob, picture.fileName);
    } catch (error) {
      setProblem((error as Error).message);
    } finally {
      setBusy(null);
    }
  }

  return (
    // biome-ignore lint/a11y/useSemanticElements: a toolbar of buttons, not a form fieldset.
    <div role="group" aria-label="Export picture" className="flex flex-wrap items-center gap-1.5 text-sm">
      <span className="flex items-center gap-1 text-ink-muted">
        <ImageDown aria-hidden className="size-4" /> Export picture:
      </span>
      {CHOICES.map(({ subject, format, words }) => {
        const key = `${subject}-${format}`;
        return (
          <Button
            key={key}
            size="sm"
            variant="ghost"
            isBusy={busy === key}
            title={`Download the ${subject} at the cursor as ${format.toUpperCase()}`}
            aria-label={`Export the ${subject} as ${format.toUpperCase()}`}
            onClick={() => run(key, subject, format, false)}
          >
            {words}
          </Button>
        );
      })}
      {onSave &&
        (['map', 'timeline'] as const).map((subject) => (
          <Button
            key={`save-${subject}`}
            size="sm"
            isBusy={busy === `save-${subject}`}
            title={`Store the ${subject} at the cursor in the case, so findings can cite it`}
            onClick={() => run(`save-${subject}`, subject, 'png', true)}
          >
            Save {subject} to case
          </Button>
        ))}
      {saved && (
        <p role="status" className="w-full text-state-ok">
          {saved}
        </p>
      )}
      {problem && (
        <p role="alert" className="w-full text-state-bad">
          {problem}
        </p>
      )}
    </div>
  );
}
