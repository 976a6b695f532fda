/**
 * Notes (the cautions) written under a chart when it is downloaded as a picture or drawing, so
 * every export carries them. Lines are wrapped to the chart's width.
 */
const FONT_PX = 12;
const LINE_PX = 16;
const PAD_PX = 10;

function wrap(notes: readonly string[], width: number): string[] {
  const perLine = Math.max(40, Math.floor((width - 2 * PAD_PX) / (FONT_PX * 0.52)));
  const lines: string[] = [];
  for (const note of notes) {
    let current = '';
    for (const word of `• ${note}`.split(' ')) {
      if (current && (current + ' ' + word).length > perLine) {
        lines.push(current);
        current = `  ${word}`;
      } else current = current ? `${current} ${word}` : word;
    }
    lines.push(current);
  }
  return lines;
}

const escapeXml = (text: string) => text.replace(/[<>&"]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;' })[c]!);

/** The chart's SVG with the notes as text below it. */
export function svgWithNotes(svg: string, width: number, height: number, notes: readonly string[]): string {
  const lines = wrap(notes, width);
  const total = height + PAD_PX + lines.length * LINE_PX + PAD_PX;
  const text = lines.map((l, i) => `<text x="${PAD_PX}" y="${height + PAD_PX + (i + 1) * LINE_PX - 4}" font-family="sans-serif" font-size="${FONT_PX}" fill="#333">${escapeXml(l)}</text>`).join('');
  const inner = svg.replace(/^<\?xml[^>]*>/, '');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${total}" viewBox="0 0 ${width} ${total}"><rect width="100%" height="100%" fill="#fff"/>${inner}${text}</svg>`;
}

/** The chart's PNG (a data URL at `pixelRatio`) with the notes drawn below it; resolves to a new data URL. */
export async function pngWithNotes(dataUrl: string, width: number, notes: readonly string[], pixelRatio: number): Promise<string> {
  const image = new Image();
  image.src = dataUrl;
  await image.decode();
  const lines = wrap(notes, width);
  const canvas = document.createElement('canvas');
  canvas.width = image.width;
  canvas.height = image.height + (2 * PAD_PX + lines.length * LINE_PX) * pixelRatio;
  const g = canvas.getContext('2d')!;
  g.fillStyle = '#ffffff';
  g.fillRect(0, 0, canvas.width, canvas.height);
  g.drawImage(image, 0, 0);
  g.fillStyle = '#333333';
  g.font = `${FONT_PX * pixelRatio}px sans-serif`;
  lines.forEach((l, i) => g.fillText(l, PAD_PX * pixelRatio, image.height + (PAD_PX + (i + 1) * LINE_PX - 4) * pixelRatio));
  return canvas.toDataURL('image/png');
}
