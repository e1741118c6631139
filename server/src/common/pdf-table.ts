/**
 * A plain table in a pdfkit document: a bold header row, then the rows, each cell wrapped to its
 * column's width. A row that would start too near the foot of the page goes to a new page.
 */
export function pdfTable(
  doc: PDFKit.PDFDocument,
  left: number,
  header: string[],
  widths: number[],
  rows: string[][],
): void {
  const draw = (cells: string[], font: string) => {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 30) doc.addPage();
    const top = doc.y;
    let x = left;
    let bottom = top;
    cells.forEach((text, i) => {
      doc
        .font(font)
        .fontSize(9)
        .text(text, x, top, { width: widths[i] - 6 });
      bottom = Math.max(bottom, doc.y);
      x += widths[i];
    });
    doc.x = left;
    doc.y = bottom + 3;
  };
  draw(header, 'bold');
  for (const row of rows) draw(row, 'regular');
}
