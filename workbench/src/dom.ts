/** Small helpers for the page: escaping text into markup, finding elements, saving a file locally. */

const ESCAPES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text made safe for markup and attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]!);
}

/** The element with `id`, of the expected kind (a missing element is a defect of index.html). */
export function byId<T extends HTMLElement>(id: string, kind: { new (): T }): T {
  const el = document.getElementById(id);
  if (!(el instanceof kind)) throw new Error(`index.html: expected a ${kind.name} with id "${id}"`);
  return el;
}

/** Saves `text` as a file through the browser's download, from memory: nothing is sent anywhere. */
export function saveText(fileName: string, text: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
