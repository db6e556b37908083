// What the screen still needs, in the advisor's words: each problem the shared readings schema finds
// becomes the record it belongs to, the page where it is fixed, and the schema's own plain message.
// Schema paths and codes never reach the screen.
import { isSchemaText } from './field-messages';

export interface ReadingIssue {
  /** The record, in words: "Flow measurement 2", "Delivery pipe". */
  record: string;
  /** The capture page that fixes it (a path under /field/visit/). */
  page: 'flow' | 'fall' | 'pipes' | 'demand';
  message: string;
}

type Path = readonly PropertyKey[];

const nth = (path: Path) => (typeof path[1] === 'number' ? ` ${path[1] + 1}` : '');

function whereOf(path: Path): Omit<ReadingIssue, 'message'> {
  switch (path[0]) {
    case 'flowMeasurements':
      return { record: `Flow measurement${nth(path)}`, page: 'flow' };
    case 'fallRuns':
      return { record: `Fall run${nth(path)}`, page: 'fall' };
    case 'lift':
      return { record: 'Lift to the tank', page: 'fall' };
    case 'drivePipe':
      return { record: 'Drive pipe', page: 'pipes' };
    case 'feedPipe':
      return { record: 'Feed pipe', page: 'pipes' };
    case 'deliveryPipe':
      return { record: 'Delivery pipe', page: 'pipes' };
    case 'demand':
      return { record: 'Water needed', page: 'demand' };
    default:
      return { record: 'The readings', page: 'flow' };
  }
}

/** A message a person can act on: the schema's own sentence, or a plain one where zod's default would show. */
function plain(path: Path, message: string): string {
  const wholeRecordMissing = path.length === 1 && / is needed\.?$/.test(message);
  if (!isSchemaText(message) && !wholeRecordMissing) return message;
  if (path[0] === 'deliveryPipe') return 'Measure the delivery pipe from the ram to the tank.';
  if (path[0] === 'lift') return 'Book the lift from the ram to the tank water level.';
  return 'This reading is missing or incomplete.';
}

/** The schema's issues as records to fix, one line per record and message, in the order found. */
export function readingIssues(issues: readonly { path: Path; message: string }[], most = 5): ReadingIssue[] {
  const seen = new Set<string>();
  const out: ReadingIssue[] = [];
  for (const issue of issues) {
    const where = whereOf(issue.path);
    const message = plain(issue.path, issue.message);
    const key = `${where.record}|${message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ ...where, message });
    if (out.length >= most) break;
  }
  return out;
}
