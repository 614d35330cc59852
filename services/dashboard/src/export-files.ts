/**
 * Saving figures and data from the page: SVG (the same drawing as `betasweep plot`, built
 * with Observable Plot in this document), PNG (that SVG rasterised at twice its size) and CSV.
 */
import type { Figure } from '../../plot/figure-model.js';
import { renderFigureSvg } from '../../plot/render-figure-svg.js';

/** Width of exported figures, px (the command line's default too). */
export const EXPORT_WIDTH = 760;

/** Offers `blob` as a download named `name`. */
export function download(blob: Blob, name: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.rel = 'noopener';
  a.style.display = 'none';
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** The figure as SVG text. */
export function figureSvg(fig: Figure): string {
  return renderFigureSvg(fig, { document, width: EXPORT_WIDTH });
}

/** Rasterises SVG text to a PNG blob at `scale`× its size. */
export async function svgToPng(svg: string, scale = 2): Promise<Blob> {
  const width = Number(/\bwidth="(\d+(?:\.\d+)?)"/.exec(svg)?.[1] ?? EXPORT_WIDTH);
  const height = Number(/\bheight="(\d+(?:\.\d+)?)"/.exec(svg)?.[1] ?? 400);
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    const img = new Image(width, height);
    img.src = url;
    await img.decode();
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('no 2D canvas');
    ctx.fillStyle = 'white';
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.scale(scale, scale);
    ctx.drawImage(img, 0, 0, width, height);
    return await new Promise<Blob>((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png'));
  } finally {
    URL.revokeObjectURL(url);
  }
}
