/**
 * On the web the page itself declares the four faces (public/index.html: WOFF2 subsets made by
 * scripts/make-fonts.mjs, under the family names constants/theme.ts uses), so the browser fetches them
 * with the page and nothing of them is in the script: the TTFs stay out of the web export.
 */
export function useAppFonts(): void {}
