// Letters that Unicode does not decompose into a base letter and an accent.
const unaccented: Record<string, string> = { ø: "o", æ: "ae", œ: "oe", ß: "ss", ł: "l", đ: "d", ð: "d", þ: "th" };

/** A URL segment from a name: accents dropped, lower case, words joined by hyphens. */
export function slugify(text: string, maxLength = 80): string {
  return text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[øæœßłđðþ]/g, (letter) => unaccented[letter] ?? letter)
    .replace(/[^a-z0-9]+/g, "-")
    .slice(0, maxLength)
    .replace(/^-+|-+$/g, "");
}

/** The first of `base`, `base-2`, `base-3`… that `taken` does not hold. */
export function firstFreeSlug(base: string, taken: ReadonlySet<string>): string {
  if (!taken.has(base)) return base;
  for (let suffix = 2; ; suffix++) {
    const candidate = `${base}-${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}
