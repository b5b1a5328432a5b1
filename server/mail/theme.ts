/**
 * The e-mail's look, written once. E-mail clients cannot read the app's stylesheet, so the colours are
 * copied here by name from tailwind.config.ts's palette (the one place they are defined for the app);
 * the font is the app's Work Sans with system fallbacks (most clients show the fallback).
 */
export const mailTheme = {
  soil: '#3d2e26', // tailwind.config.ts colors.soil.DEFAULT: body text
  paper: '#faf7f0', // colors.paper.DEFAULT: page background
  paperLine: '#e6dece', // colors.paper.200: rules and the card's edge
  leaf: '#2f6b3b', // colors.leaf.DEFAULT: the wordmark and buttons
  leafTint: '#edf4e8', // colors.leaf.50: the header band
  water: '#2e6b8c', // colors.water.DEFAULT: links
  stone: '#6f695f', // colors.stone.DEFAULT: small print
  white: '#ffffff',
  font: '"Work Sans", ui-sans-serif, system-ui, -apple-system, "Segoe UI", Roboto, Arial, sans-serif',
} as const;
