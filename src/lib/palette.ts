// The palette's values for SVG fills and strokes, from the one place they are defined (tailwind.config.ts).
export { palette } from '../../tailwind.config';
