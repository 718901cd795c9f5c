import { inflateSync } from 'node:zlib';

/**
 * The text of a PDF written with the standard fonts (as our reports are): every Flate content stream is
 * inflated and the strings of its TJ/Tj operators (hex or literal) are decoded as WinAnsi (Latin-1 for the
 * characters we use). Enough to find a table's words; not a general PDF reader.
 */
export function pdfText(pdf: Buffer): string {
  const raw = pdf.toString('latin1');
  const out: string[] = [];
  const streams = /stream\r?\n([\s\S]*?)\r?\nendstream/g;
  for (let m = streams.exec(raw); m; m = streams.exec(raw)) {
    let content: string;
    try {
      content = inflateSync(Buffer.from(m[1], 'latin1')).toString('latin1');
    } catch {
      continue; // not Flate (or an image)
    }
    // Linear patterns only (no nested alternation over the same characters): hex strings hold no ']'.
    const ops = /\[([^\]]*)\]\s*TJ|(<[0-9a-fA-F\s]*>)\s*Tj/g;
    for (let op = ops.exec(content); op; op = ops.exec(content)) {
      const body = op[1] ?? op[2];
      let text = '';
      const pieces = /<([0-9a-fA-F\s]*)>|\(([^)]*)\)/g;
      for (let p = pieces.exec(body); p; p = pieces.exec(body)) {
        if (p[1] !== undefined) text += Buffer.from(p[1].replace(/\s+/g, ''), 'hex').toString('latin1');
        else text += p[2].replace(/\\([()\\])/g, '$1');
      }
      out.push(text);
    }
  }
  return out.join(' ').replace(/\s+/g, ' ');
}
