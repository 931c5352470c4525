/**
 * Colour-blind-safe colours (Okabe & Ito 2008, "Color Universal Design") and a shape for every IMF,
 * so that series stay distinct in greyscale and for every kind of colour vision.
 */
export const COLORS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000', '#F0E442'] as const;
export type Shape = 'circle' | 'square' | 'triangle' | 'diamond' | 'cross';
export const SHAPES: readonly Shape[] = ['circle', 'square', 'triangle', 'diamond', 'cross'];
export const SHAPE_GLYPH: Record<Shape, string> = { circle: '●', square: '■', triangle: '▲', diamond: '◆', cross: '✚' };

export function styleFor(index: number): { color: string; shape: Shape } {
  return { color: COLORS[index % COLORS.length], shape: SHAPES[index % SHAPES.length] };
}

export const VERDICT_COLORS: Record<string, string> = {
  'within budget': '#009E73',
  strained: '#E69F00',
  'over budget': '#D55E00',
};
