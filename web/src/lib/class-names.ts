/** Joins class names, skipping the falsy ones used for conditional styling. */
export function classNames(...names: Array<string | false | null | undefined>): string {
  return names.filter(Boolean).join(' ');
}
