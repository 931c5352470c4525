import type { Shape } from '../palette.js';

/** Draws one marker shape centred on (x, y) with half-size r on a 2D canvas context. */
export function drawMarker(ctx: CanvasRenderingContext2D, shape: Shape, x: number, y: number, r: number): void {
  ctx.beginPath();
  switch (shape) {
    case 'circle':
      ctx.arc(x, y, r, 0, 2 * Math.PI);
      break;
    case 'square':
      ctx.rect(x - r, y - r, 2 * r, 2 * r);
      break;
    case 'triangle':
      ctx.moveTo(x, y - r * 1.2);
      ctx.lineTo(x + r * 1.1, y + r * 0.9);
      ctx.lineTo(x - r * 1.1, y + r * 0.9);
      ctx.closePath();
      break;
    case 'diamond':
      ctx.moveTo(x, y - r * 1.3);
      ctx.lineTo(x + r * 1.1, y);
      ctx.lineTo(x, y + r * 1.3);
      ctx.lineTo(x - r * 1.1, y);
      ctx.closePath();
      break;
    case 'cross':
      ctx.rect(x - r, y - r / 3, 2 * r, (2 * r) / 3);
      ctx.rect(x - r / 3, y - r, (2 * r) / 3, 2 * r);
      break;
  }
}

/** The same shapes as SVG elements. */
export function svgMarker(shape: Shape, x: number, y: number, r: number, color: string): string {
  const f = `fill="${color}" stroke="#000" stroke-width="0.6"`;
  switch (shape) {
    case 'circle':
      return `<circle cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${r}" ${f}/>`;
    case 'square':
      return `<rect x="${(x - r).toFixed(1)}" y="${(y - r).toFixed(1)}" width="${2 * r}" height="${2 * r}" ${f}/>`;
    case 'triangle':
      return `<polygon points="${x},${y - r * 1.2} ${x + r * 1.1},${y + r * 0.9} ${x - r * 1.1},${y + r * 0.9}" ${f}/>`;
    case 'diamond':
      return `<polygon points="${x},${y - r * 1.3} ${x + r * 1.1},${y} ${x},${y + r * 1.3} ${x - r * 1.1},${y}" ${f}/>`;
    case 'cross':
      return `<path d="M${x - r},${y - r / 3}h${2 * r}v${(2 * r) / 3}h${-2 * r}z M${x - r / 3},${y - r}h${(2 * r) / 3}v${2 * r}h${(-2 * r) / 3}z" ${f}/>`;
  }
}
