import Papa from 'papaparse';

export interface CsvPreview {
  headers: string[];
  rows: Record<string, string>[];
  /** Parse problems in the previewed rows, e.g. a row with too few fields. */
  problems: string[];
}

/** How much of a file to read for the preview: ample for 20 rows, tiny next to a season's table. */
const PREVIEW_BYTES = 256 * 1024;

/** The header and first rows of CSV text; values kept as text (typing them is the server's job). */
export function parseCsvPreview(text: string, rowCount = 20): CsvPreview {
  const result = Papa.parse<Record<string, string>>(text, {
    header: true,
    preview: rowCount,
    skipEmptyLines: 'greedy',
    dynamicTyping: false,
  });
  return {
    headers: (result.meta.fields ?? []).filter((h) => h.trim() !== ''),
    rows: result.data,
    // A comma is the fallback when too few rows show a delimiter, and the right guess for CSV.
    problems: result.errors
      .filter((e) => e.code !== 'UndetectableDelimiter')
      .map((e) => (e.row === undefined ? e.message : `Row ${e.row + 1}: ${e.message}`)),
  };
}

/** Reads only the start of the file, so a large table previews at once. */
export async function readCsvPreview(file: File, rowCount = 20): Promise<CsvPreview> {
  const text = await file.slice(0, PREVIEW_BYTES).text();
  return parseCsvPreview(text, rowCount);
}
