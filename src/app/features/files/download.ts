/** Saves a Blob under a file name through a temporary object URL (the browser's own download). */
export function saveBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** A name safe for a downloaded file: letters, digits, spaces, dot, dash and underscore. */
export function fileStem(name: string): string {
  return name.replace(/[^\w.\- ]+/g, '_').trim().slice(0, 120) || 'design';
}
