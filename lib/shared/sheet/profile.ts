// The elevation profile as geometry: intake → drive pipe → ram → delivery pipe → tank, heights and
// lengths to scale (each axis its own scale, the vertical exaggeration stated). Drawn by the page
// and the PDF alike as the same SVG markup (drawing-svg.ts).
import type { UnitSystem } from '../domain';
import { mToFt } from '../units';
import { quantity } from '../display/quantities';

export interface ProfileInput {
  fallM: number;
  staticLiftM: number;
  driveLengthM: number;
  deliveryLengthM: number;
  /** The tank fills by gravity: the low point is no ram and the pipe runs on to the tank. */
  gravity?: boolean;
}

export interface ProfileNode {
  key: 'intake' | 'pump' | 'tank';
  x: number;
  y: number;
  label: string;
  height: string;
}
export interface ProfilePipe {
  key: 'drive' | 'delivery';
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  label: string;
}
export interface GridLine {
  at: number;
  label: string;
}

export interface ProfileGeometry {
  width: number;
  height: number;
  plot: { x: number; y: number; w: number; h: number };
  nodes: ProfileNode[];
  pipes: ProfilePipe[];
  xGrid: GridLine[];
  yGrid: GridLine[];
  /** "Heights drawn 8 × larger than lengths", or '' when drawn true. */
  exaggeration: string;
  /** Accessible description of the drawing in words. */
  description: string;
  /** How the two pipes are told apart in the drawing. */
  legend: string;
}

/** A "nice" grid step (1, 2 or 5 × 10ⁿ) giving about `target` divisions of `span`. */
export function niceStep(span: number, target: number): number {
  if (!(span > 0)) return 1;
  const raw = span / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const m = raw / power;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * power;
}

// Horizontal distance along a pipe laid on a slope: the pipe length is measured along the ground.
const run = (pipeM: number, riseM: number): number => (pipeM > Math.abs(riseM) ? Math.sqrt(pipeM ** 2 - riseM ** 2) : Math.max(pipeM, 1));

/** Geometry of the profile in a width × height box (SVG user units or PDF points). */
export function profileGeometry(p: ProfileInput, units: UnitSystem, width = 640, height = 320): ProfileGeometry {
  // Room above for the intake and tank labels, below for the axis and the ram's label.
  const plot = { x: 56, y: 44, w: width - 56 - 28, h: height - 44 - 62 };
  const driveRun = run(p.driveLengthM, p.fallM);
  const deliveryRun = run(p.deliveryLengthM, p.staticLiftM);
  const spanX = driveRun + deliveryRun;
  const spanY = Math.max(p.fallM, p.staticLiftM, 1);
  const sx = plot.w / spanX;
  const sy = plot.h / spanY;
  const X = (m: number) => plot.x + m * sx;
  const Y = (m: number) => plot.y + plot.h - m * sy;
  const toUnits = (m: number) => (units === 'us' ? mToFt(m) : m);
  const fromUnits = (v: number) => (units === 'us' ? v * 0.3048 : v);
  const unit = units === 'us' ? 'ft' : 'm';

  const stepY = niceStep(toUnits(spanY), 4);
  const yGrid: GridLine[] = [];
  for (let v = 0; v <= toUnits(spanY) + 1e-9; v += stepY) yGrid.push({ at: Y(fromUnits(v)), label: `${+v.toFixed(3)} ${unit}` });
  const stepX = niceStep(toUnits(spanX), 5);
  const xGrid: GridLine[] = [];
  for (let v = 0; v <= toUnits(spanX) + 1e-9; v += stepX) xGrid.push({ at: X(fromUnits(v)), label: `${+v.toFixed(3)} ${unit}` });

  const nodes: ProfileNode[] = [
    {
      key: 'intake',
      x: X(0),
      y: Y(p.fallM),
      label: 'Intake',
      height: `${quantity(p.fallM, 'length', units).text} above the ${p.gravity ? 'low point' : 'ram'}`,
    },
    { key: 'pump', x: X(driveRun), y: Y(0), label: p.gravity ? 'Low point' : 'Ram pump', height: 'height 0' },
    {
      key: 'tank',
      x: X(spanX),
      y: Y(p.staticLiftM),
      label: 'Tank',
      height: `${quantity(p.staticLiftM, 'length', units).text} above the ${p.gravity ? 'low point' : 'ram'}`,
    },
  ];
  const [intake, pump, tank] = nodes as [ProfileNode, ProfileNode, ProfileNode];
  const driveLabel = `${p.gravity ? 'Pipe' : 'Drive pipe'} ${quantity(p.driveLengthM, 'pipeLength', units).text}`;
  const deliveryLabel = `${p.gravity ? 'Pipe' : 'Delivery pipe'} ${quantity(p.deliveryLengthM, 'pipeLength', units).text}`;
  const pipes: ProfilePipe[] = [
    { key: 'drive', x1: intake.x, y1: intake.y, x2: pump.x, y2: pump.y, label: driveLabel },
    { key: 'delivery', x1: pump.x, y1: pump.y, x2: tank.x, y2: tank.y, label: deliveryLabel },
  ];
  const ratio = sy / sx;
  const exaggeration =
    ratio > 1.5
      ? `Heights drawn ${Math.round(ratio)} × larger than lengths`
      : ratio < 0.67
        ? `Lengths drawn ${Math.round(1 / ratio)} × larger than heights`
        : '';
  const description = p.gravity
    ? `Elevation profile: the intake is ${nodes[0]?.height}; the water runs down ${quantity(p.driveLengthM, 'pipeLength', units).text} of pipe to the low point, then ${quantity(p.deliveryLengthM, 'pipeLength', units).text} on to the tank, ${tank.height} and below the intake.`
    : `Elevation profile: the intake is ${nodes[0]?.height}; the water runs down the ${driveLabel.toLowerCase()} to the ram pump, then up the ${deliveryLabel.toLowerCase()} to the tank, ${tank.height}.`;
  const legend = p.gravity ? 'Pipe to the low point solid, on to the tank dashed.' : 'Drive pipe solid, delivery pipe dashed.';
  return { width, height, plot, nodes, pipes, xGrid, yGrid, exaggeration, description, legend };
}

/** A text's width estimated from its length (about 0.58 em a character, 0.62 em bold): enough to keep labels inside the frame. */
export function textWidth(text: string, size: number, bold = false): number {
  return Array.from(text).length * size * (bold ? 0.62 : 0.58);
}

export interface LabelAnchor {
  /** Left edge and width of the label's box, kept inside the drawing. */
  x: number;
  y: number;
  width: number;
  align: 'left' | 'right';
  /** SVG text-anchor; the text's x is `x` for start and `x + width` for end. */
  anchor: 'start' | 'end';
}

// Label sizes in drawing units: the page and the PDF both draw them at these sizes.
export const LABEL_SIZE = 13;
export const NOTE_SIZE = 12;

function inside(g: { width: number }, x: number, width: number): number {
  return Math.min(Math.max(x, 2), Math.max(g.width - 2 - width, 2));
}

function box(g: ProfileGeometry, left: number, y: number, width: number, align: 'left' | 'right'): LabelAnchor {
  return { x: inside(g, left, width), y: Math.max(y, 2), width, align, anchor: align === 'left' ? 'start' : 'end' };
}

/** Where a point's two-line label goes: clear of the pipes and inside the frame. */
export function nodeLabelAt(g: ProfileGeometry, node: ProfileNode): LabelAnchor {
  const width = Math.max(textWidth(node.label, LABEL_SIZE, true), textWidth(node.height, NOTE_SIZE));
  // The tank's label ends left of the tank, so the tank and its height are always in view.
  if (node.key === 'tank') return box(g, node.x - 24 - width, node.y - 36, width, 'right');
  // The ram sits on the baseline: its label goes under the axis labels.
  if (node.key === 'pump') return box(g, node.x - 10, g.plot.y + g.plot.h + 22, width, 'left');
  return box(g, node.x - 10, node.y - 38, width, 'left');
}

/** Where a pipe's length label goes: above the delivery line, beside the drive line. */
export function profileLabelAt(g: ProfileGeometry, pipe: ProfilePipe): LabelAnchor {
  const width = textWidth(pipe.label, LABEL_SIZE, true);
  const mx = (pipe.x1 + pipe.x2) / 2;
  const my = (pipe.y1 + pipe.y2) / 2;
  if (pipe.key === 'delivery') return box(g, mx - 6 - width, my - 22, width, 'right');
  // A short drive pipe is labelled beside the ram's label, under the axis.
  if (Math.abs(pipe.x2 - pipe.x1) < 170) {
    const pump = g.nodes.find((n) => n.key === 'pump');
    const pumpLabel = pump ? nodeLabelAt(g, pump) : null;
    return box(g, pumpLabel ? pumpLabel.x + pumpLabel.width + 12 : pipe.x2 + 90, g.plot.y + g.plot.h + 22, width, 'left');
  }
  return box(g, mx + 8, my - 4, width, 'left');
}
