/**
 * A revision made from a study keeps the fastener line codes the part already had, so hole ids (U-07)
 * mean the same hole from revision to revision: the study names its lines by their initials ("Upper
 * flange" → UF), which would rename every hole. A new line is matched to an old one by name, else by
 * its place among the lines of the same surface; a line with no match, or whose old code another line
 * already took, keeps the study's code.
 */
export function keepLineCodes<L extends { code: string; name: string; surface: string }>(
  previous: readonly { code: string; name: string; surface: string }[],
  next: readonly L[],
): L[] {
  const norm = (s: string) => s.trim().toLowerCase();
  const nthOfSurface = (lines: readonly { surface: string }[], i: number) =>
    lines.slice(0, i).filter((l) => l.surface === lines[i].surface).length;
  // Matches by name first: a line that kept its name keeps its code even if another line now sits in its place.
  const byName = next.map(
    (line) => previous.find((p) => norm(p.name) === norm(line.name) && p.surface === line.surface)?.code ?? null,
  );
  const claimed = new Set(byName.filter((c): c is string => c !== null));
  const picked = next.map((line, i) => {
    if (byName[i]) return byName[i];
    const byPlace = previous.filter((p) => p.surface === line.surface)[nthOfSurface(next, i)]?.code;
    return byPlace && !claimed.has(byPlace) ? byPlace : null;
  });
  for (const c of picked) if (c) claimed.add(c);
  // A line without an old code keeps the study's, unless an old line keeps that one: then it is numbered.
  const taken = new Set<string>();
  return next.map((line, i) => {
    const code = picked[i];
    if (code && !taken.has(code)) {
      taken.add(code);
      return { ...line, code };
    }
    const own = !claimed.has(line.code) && !taken.has(line.code) ? line.code : `${line.code}${i + 1}`;
    taken.add(own);
    return { ...line, code: own };
  });
}
