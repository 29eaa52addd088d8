import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';

/** Text of each page of a PDF (pdfjs-dist, legacy build for Node), items joined by spaces. */
export async function pdfPages(pdf: Buffer): Promise<string[]> {
  const doc = await pdfjs.getDocument({ data: new Uint8Array(pdf), useSystemFonts: false, isEvalSupported: false }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent();
    pages.push(content.items.map((it) => ('str' in it ? it.str : '')).join(' ').replace(/\s+/g, ' '));
  }
  await doc.destroy();
  return pages;
}
