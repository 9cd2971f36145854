/** Route params can arrive as a string, a list (repeated key) or not at all. */
export function oneParam(v: string | string[] | undefined): string {
  return (Array.isArray(v) ? v[0] : v) ?? '';
}
