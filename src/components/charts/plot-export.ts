/** One CSV field: quoted when it holds a comma, a quote or a line break (RFC 4180, section 2). */
export function csvField(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  const text = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : '') : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows as CSV text, CRLF between records as RFC 4180 asks. */
export function toCsv(rows: readonly (readonly (string | number | null | undefined)[])[]): string {
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}

/** A file name from a title: lower case, words joined by hyphens, nothing a file system refuses. */
export function fileNameFor(title: string, extension: string): string {
  const stem = title
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/[\s_]+/g, '-')
    .slice(0, 60);
  return `${stem || 'plot'}.${extension}`;
}

function save(blob: Blob, fileName: string) {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadCsv(rows: Parameters<typeof toCsv>[0], fileName: string) {
  save(new Blob([toCsv(rows)], { type: 'text/csv;charset=utf-8' }), fileName);
}

const pageColor = (name: string, fallback: string) => getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;

/** An SVG's drawing on a canvas: the page's colour variables written in, since an image cannot read them. */
async function svgToCanvas(svg: SVGSVGElement): Promise<HTMLCanvasElement> {
  const rect = svg.getBoundingClientRect();
  const scale = Math.max(2, window.devicePixelRatio || 1);
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  copy.setAttribute('width', String(rect.width));
  copy.setAttribute('height', String(rect.height));
  for (const node of [copy, ...copy.querySelectorAll('*')]) {
    for (const attr of ['stroke', 'fill']) {
      const m = /^var\((--[\w-]+)\)$/.exec(node.getAttribute(attr) ?? '');
      if (m) node.setAttribute(attr, pageColor(m[1], '#888'));
    }
  }
  const image = new Image();
  image.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(new XMLSerializer().serializeToString(copy))}`;
  await image.decode();
  const canvas = document.createElement('canvas');
  canvas.width = Math.round(rect.width * scale);
  canvas.height = Math.round(rect.height * scale);
  canvas.getContext('2d')!.drawImage(image, 0, 0, canvas.width, canvas.height);
  return canvas;
}

/**
 * The plot inside `container` (a uPlot canvas or an SVG) as a PNG, on the page's own
 * background so it reads the same in a report as on screen.
 */
export async function downloadPlotPng(container: Element, fileName: string) {
  const drawn = container.querySelector('canvas') ?? (container.querySelector('svg') ? await svgToCanvas(container.querySelector('svg')!) : null);
  if (!drawn) return;
  const out = document.createElement('canvas');
  out.width = drawn.width;
  out.height = drawn.height;
  const ctx = out.getContext('2d')!;
  ctx.fillStyle = pageColor('--ft-sheet', '#ffffff');
  ctx.fillRect(0, 0, out.width, out.height);
  ctx.drawImage(drawn, 0, 0);
  const blob = await new Promise<Blob | null>((resolve) => out.toBlob(resolve, 'image/png'));
  if (blob) save(blob, fileName);
}
