/** PNGs are drawn at twice the SVG's size so text stays sharp when a report is zoomed or printed. */
export const PNG_SCALE = 2;

/** Reads the width and height attributes of a standalone SVG document, px. */
function svgSize(svgText: string): { width: number; height: number } {
  const root = new DOMParser().parseFromString(svgText, 'image/svg+xml').documentElement;
  return { width: Number(root.getAttribute('width')), height: Number(root.getAttribute('height')) };
}

/** Draws a standalone SVG document onto a canvas and encodes it as PNG. */
export async function rasteriseSvg(svgText: string): Promise<Blob> {
  const { width, height } = svgSize(svgText);
  const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.src = url;
    await image.decode();
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * PNG_SCALE);
    canvas.height = Math.round(height * PNG_SCALE);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('This browser cannot draw the picture (no 2D canvas).');
    ctx.drawImage(image, 0, 0, canvas.width, canvas.height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob(
        (blob) => (blob ? resolve(blob) : reject(new Error('This browser could not encode the PNG.'))),
        'image/png',
      ),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Hands a file to the browser's download, under `fileName`. */
export function downloadBlob(blob: Blob, fileName: string) {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  // Revoked on the next turn: the click has started the download by then.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
