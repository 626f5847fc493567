// Files in and out of the browser without a network: a download made from memory (a blob: URL) and
// the text of a file the user picked.

/** Offer text as a file download. */
export function downloadText(name: string, text: string, type = 'application/json'): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** The text of a picked file (UTF-8). */
export function readText(file: File): Promise<string> {
  return file.text();
}
