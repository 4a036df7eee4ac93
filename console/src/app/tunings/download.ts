/** A file name from a tuning's name: "Bass-managed-80-Hz-v3.json". */
export function downloadName(name: string, version: number, extension: string): string {
  const base = name.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '') || 'tuning';
  return `${base}-v${version}.${extension}`;
}

/** Hands a downloaded answer to the browser as a file. */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
