import Papa from 'papaparse';

const SVG_NS = 'http://www.w3.org/2000/svg';

/** Presentation properties that the app's stylesheet sets on plots; copied inline so a file keeps them. */
const STYLED = [
  'fill',
  'fill-opacity',
  'stroke',
  'stroke-width',
  'stroke-opacity',
  'stroke-dasharray',
  'opacity',
  'font-family',
  'font-size',
  'font-weight',
  'text-anchor',
  'dominant-baseline',
  'paint-order',
] as const;

/**
 * A standalone copy of an on-screen SVG: the stylesheet's look copied onto each element (a file has no
 * access to the page's CSS), the namespace set, and a plain background so it reads the same anywhere.
 */
export function standaloneSvg(svg: SVGSVGElement): string {
  const copy = svg.cloneNode(true) as SVGSVGElement;
  const originals = [svg, ...svg.querySelectorAll('*')];
  const copies = [copy, ...copy.querySelectorAll('*')];
  originals.forEach((el, i) => {
    const style = getComputedStyle(el);
    const target = copies[i] as SVGElement;
    const inline = STYLED.map((p) => [p, style.getPropertyValue(p)] as const)
      .filter(([, v]) => v !== '')
      .map(([p, v]) => `${p}:${v}`)
      .join(';');
    if (inline) target.setAttribute('style', `${inline};${target.getAttribute('style') ?? ''}`);
  });
  copy.setAttribute('xmlns', SVG_NS);
  const box = svg.viewBox.baseVal;
  if (box && box.width > 0) {
    copy.setAttribute('width', String(box.width));
    copy.setAttribute('height', String(box.height));
    const background = document.createElementNS(SVG_NS, 'rect');
    background.setAttribute('x', String(box.x));
    background.setAttribute('y', String(box.y));
    background.setAttribute('width', String(box.width));
    background.setAttribute('height', String(box.height));
    background.setAttribute('fill', '#ffffff');
    copy.insertBefore(background, copy.firstChild);
  }
  return new XMLSerializer().serializeToString(copy);
}

function download(blob: Blob, fileName: string) {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  // Give the browser a moment to start the download before the address is released.
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadSvg(svg: SVGSVGElement, fileName: string) {
  download(new Blob([standaloneSvg(svg)], { type: 'image/svg+xml' }), `${fileName}.svg`);
}

/**
 * PNG at twice the SVG's size: the standalone SVG drawn onto a canvas, all in the browser. The image is
 * given as a data: address, which the app's content security policy allows for images (blob: it does not).
 */
export async function downloadPng(svg: SVGSVGElement, fileName: string, scale = 2): Promise<void> {
  const box = svg.viewBox.baseVal;
  const width = Math.round((box?.width || svg.clientWidth || 800) * scale);
  const height = Math.round((box?.height || svg.clientHeight || 600) * scale);
  const url = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(standaloneSvg(svg))}`;
  const image = new Image();
  await new Promise<void>((resolve, reject) => {
    image.onload = () => resolve();
    image.onerror = () => reject(new Error('The figure could not be drawn as an image.'));
    image.src = url;
  });
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  const context = canvas.getContext('2d');
  if (!context) throw new Error('This browser cannot draw onto a canvas.');
  context.drawImage(image, 0, 0, width, height);
  const png = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
  if (!png) throw new Error('The image could not be encoded as PNG.');
  download(png, `${fileName}.png`);
}

/** CSV of plain rows (the same columns in every row), written by papaparse. */
export function toCsv(rows: Record<string, string | number | null>[]): string {
  return Papa.unparse(rows, { newline: '\n' });
}

export function downloadCsv(rows: Record<string, string | number | null>[], fileName: string) {
  download(new Blob([toCsv(rows)], { type: 'text/csv;charset=utf-8' }), `${fileName}.csv`);
}
