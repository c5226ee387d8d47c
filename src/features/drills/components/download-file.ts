import type { Drill } from '@shared/engine';

/** Saves bytes as a file through the browser's own download. */
export function downloadBytes(bytes: Uint8Array | string, name: string, type: string) {
  const blob = new Blob([bytes as BlobPart], { type });
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.rel = 'noopener';
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

const slug = (s: string) =>
  s
    .replace(/#/g, 'sharp')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .toLowerCase();

/** sixfold-<pair>-<pattern>-<key>: the key is triad a's root in this drill. */
export function fileBase(drill: Drill): string {
  const { pair, pattern } = drill.spec;
  const patternName = typeof pattern === 'string' ? pattern : pattern.name;
  const key = /^[A-G](#|b)?/.exec(pair[0])?.[0] ?? pair[0];
  return `sixfold-${slug(pair.join('-'))}-${slug(patternName)}-${slug(key)}`;
}
