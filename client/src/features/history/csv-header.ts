/** Reads the first line of a CSV file and tells whether it names a zone column. */
export function headerHasZone(firstLine: string): boolean {
  return firstLine
    .replace(/^\uFEFF/, '')
    .split(/[,;\t]/)
    .some((cell) => cell.trim().replace(/^"|"$/g, '').toLowerCase() === 'zone');
}

export async function fileHasZoneColumn(file: File): Promise<boolean> {
  const head = await file.slice(0, 4096).text();
  return headerHasZone(head.split(/\r?\n/, 1)[0] ?? '');
}
