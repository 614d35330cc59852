/**
 * Figures outside a browser (`betasweep plot`): SVG built with Observable Plot in a linkedom
 * document, PNG rasterised from that SVG with resvg (system fonts: DejaVu Sans on Debian).
 * Node only; the dashboard does the same with the page's document and a canvas.
 */
import { Resvg } from '@resvg/resvg-js';
import { parseHTML } from 'linkedom';
import type { Figure } from './figure-model.js';
import { renderFiguresSvg } from './render-figure-svg.js';

/** A fresh DOM document for Observable Plot. */
export function nodeDocument(): Document {
  return parseHTML('<!doctype html><html><head></head><body></body></html>').document as unknown as Document;
}

/** Options of {@link figuresToSvg}. */
export interface NodeSvgOptions {
  /** Width of the document, px. @defaultValue 760 */
  width?: number;
  /** Heading above the figures (the sweep's label). */
  heading?: string;
}

/** The figures stacked in one SVG document. */
export function figuresToSvg(figures: Figure[], options: NodeSvgOptions = {}): string {
  return renderFiguresSvg(figures, { document: nodeDocument(), width: options.width ?? 760, heading: options.heading });
}

/** Rasterises SVG text to PNG bytes at `scale`× its size. */
export function svgToPngBytes(svg: string, scale = 2): Buffer {
  const width = Number(/\bwidth="(\d+(?:\.\d+)?)"/.exec(svg)?.[1] ?? 760);
  const resvg = new Resvg(svg, {
    font: { loadSystemFonts: true, defaultFontFamily: 'DejaVu Sans', sansSerifFamily: 'DejaVu Sans' },
    fitTo: { mode: 'width', value: Math.round(width * scale) },
    background: 'white',
  });
  return resvg.render().asPng();
}
