/**
 * The one rule for a new id or name inside a list: the wanted one when it is free, otherwise the
 * first of `base-2`, `base-3`, … (ids) or `base 2`, `base 3`, … (names) that nothing uses, kept
 * within the schema's length limit by shortening the base.
 */

function firstFree(base: string, taken: Iterable<string>, separator: string, maxLength: number): string {
  const used = new Set(taken);
  const wanted = base.slice(0, maxLength);
  if (!used.has(wanted)) return wanted;
  for (let n = 2; ; n++) {
    const suffix = `${separator}${n}`;
    const candidate = `${base.slice(0, Math.max(0, maxLength - suffix.length))}${suffix}`;
    if (!used.has(candidate)) return candidate;
  }
}

/** `base`, or `base-2`, `base-3`, …: the first id not in `taken`, at most `maxLength` characters. */
export function freeId(base: string, taken: Iterable<string>, maxLength = 60): string {
  return firstFree(base, taken, '-', maxLength);
}

/** `name`, or `name 2`, `name 3`, …: the first name not in `taken`, at most `maxLength` characters. */
export function freeName(name: string, taken: Iterable<string>, maxLength = 120): string {
  return firstFree(name, taken, ' ', maxLength);
}
