import { type ReactNode, useState } from 'react';

/**
 * A dashed area that takes dropped files. Dropping is a mouse shortcut: every use keeps a
 * labelled file field or button inside or beside it as the keyboard path.
 */
export function DropZone({
  onFiles,
  testId,
  className = '',
  children,
}: {
  onFiles: (files: File[]) => void;
  testId: string;
  className?: string;
  children: ReactNode;
}) {
  const [isDragOver, setIsDragOver] = useState(false);
  return (
    // biome-ignore lint/a11y/noStaticElementInteractions: dropping is a mouse shortcut; the labelled controls are the keyboard path.
    <div
      onDragOver={(event) => {
        event.preventDefault();
        setIsDragOver(true);
      }}
      onDragLeave={() => setIsDragOver(false)}
      onDrop={(event) => {
        event.preventDefault();
        setIsDragOver(false);
        onFiles([...event.dataTransfer.files]);
      }}
      data-testid={testId}
      className={`flex flex-col items-center rounded-lg border-2 border-dashed px-6 text-center ${isDragOver ? 'border-accent bg-accent-soft' : 'border-canvas-line bg-canvas-raised'} ${className}`}
    >
      {children}
    </div>
  );
}
