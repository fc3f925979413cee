import { FormArray, type FormBuilder, type FormControl, type FormGroup } from '@angular/forms';
import type { CoordinateMapping, RecordingInspection, RecordingMappingInput } from '../../../../../shared/schemas/recording';

export type ColumnAndUnit = FormGroup<{ column: FormControl<string>; unit: FormControl<string> }>;
export type CoordinateForm = FormGroup<{
  name: FormControl<string>;
  column: FormControl<string>;
  unit: FormControl<string>;
  /** Column '' means "estimate from positions". */
  velocity: ColumnAndUnit;
  /** Column '' means "no force recorded on this coordinate". */
  force: ColumnAndUnit;
}>;
export type MappingForm = FormGroup<{
  name: FormControl<string>;
  time: ColumnAndUnit;
  coordinates: FormArray<CoordinateForm>;
}>;

export interface CoordinateDraft {
  name: string;
  column: string;
  unit: string;
  velocity: { column: string; unit: string };
  force: { column: string; unit: string };
}

export function createMappingForm(fb: FormBuilder): MappingForm {
  const nn = fb.nonNullable;
  return nn.group({
    name: nn.control(''),
    time: nn.group({ column: nn.control(''), unit: nn.control('s') }),
    coordinates: new FormArray<CoordinateForm>([]),
  });
}

export function createCoordinateForm(fb: FormBuilder, draft: CoordinateDraft): CoordinateForm {
  const nn = fb.nonNullable;
  return nn.group({
    name: nn.control(draft.name),
    column: nn.control(draft.column),
    unit: nn.control(draft.unit),
    velocity: nn.group({ column: nn.control(draft.velocity.column), unit: nn.control(draft.velocity.unit) }),
    force: nn.group({ column: nn.control(draft.force.column), unit: nn.control(draft.force.unit) }),
  });
}

/** The mapping the upload sends: empty velocity and force columns are left out. */
export function toMapping(value: ReturnType<MappingForm['getRawValue']>): RecordingMappingInput {
  return {
    time: { column: value.time.column, unit: value.time.unit },
    coordinates: value.coordinates.map((c): CoordinateMapping => ({
      name: c.name,
      column: c.column,
      unit: c.unit,
      ...(c.velocity.column ? { velocity: { column: c.velocity.column, unit: c.velocity.unit } } : {}),
      ...(c.force.column ? { force: { column: c.force.column, unit: c.force.unit } } : {}),
    })),
  };
}

const angleName = /^(th|theta|phi|ph|psi|alpha|beta|gamma|q|angle|a)\d*$/i;
const forceLike = /(force|torque|tau)|^(u|f)_/i;
const velocityPattern = [/^d(.+)$/, /^(.+?)_?dot$/i, /^v_?(.+)$/i, /^omega_?(.+)$/i];
/** Units written as a suffix of the column name (`cart_x_m`, `pole_angle_rad`, `cart_force_N`). */
const unitSuffix = /[_ ]?\[?(m|mm|cm|rad|deg|N|Nm|N_m|kg|s)\]?$/;

function unitOf(column: string): string | null {
  const match = unitSuffix.exec(column);
  if (!match || match.index === 0) return null;
  const unit = match[1]!;
  return unit === 'Nm' || unit === 'N_m' ? 'N*m' : unit;
}

/** A coordinate name from a column name: the unit suffix dropped, letters, digits and _ only, starting with a letter. */
export function coordinateNameFrom(column: string): string {
  const bare = unitOf(column) ? column.replace(unitSuffix, '') : column;
  const cleaned = bare.replace(/\[.*?\]|\(.*?\)/g, '').trim().replace(/[^A-Za-z0-9_]+/g, '_').replace(/^_+|_+$/g, '');
  return /^[A-Za-z]/.test(cleaned) ? cleaned.slice(0, 40) : `q_${cleaned}`.slice(0, 40);
}

function commonPrefixLength(a: string, b: string): number {
  let n = 0;
  while (n < a.length && n < b.length && a[n]!.toLowerCase() === b[n]!.toLowerCase()) n++;
  return n;
}

/**
 * A first guess at the mapping from the file alone: the suggested time column; force-like columns (`u_x`,
 * `cart_force_N`) as the force on the coordinate whose column shares most of their name; `d<name>`-like
 * columns as velocities; every other numeric column a coordinate. Units come from name suffixes (`_m`,
 * `_rad`), else radians for angle-like names and metres otherwise. The user corrects what is wrong.
 */
export function suggestMapping(inspection: RecordingInspection): { timeColumn: string; coordinates: CoordinateDraft[] } {
  const numeric = inspection.numericColumns;
  const timeColumn = inspection.suggestedTimeColumn ?? numeric[0] ?? inspection.header[0] ?? '';
  const rest = numeric.filter((c) => c !== timeColumn);
  const forceColumns = rest.filter((c) => forceLike.test(c));
  const velocities = new Map<string, string>();
  for (const column of rest) {
    for (const pattern of velocityPattern) {
      const match = pattern.exec(column);
      if (match && rest.includes(match[1]!) && match[1] !== column) {
        velocities.set(match[1]!, column);
        break;
      }
    }
  }
  const taken = new Set([...forceColumns, ...velocities.values()]);
  const positions = rest.filter((column) => !taken.has(column)).slice(0, 8);
  const forces = new Map<string, string>();
  for (const force of forceColumns) {
    const target = [...positions].sort((a, b) => commonPrefixLength(b, force) - commonPrefixLength(a, force))[0];
    if (target && !forces.has(target)) forces.set(target, force);
  }
  const coordinates = positions.map((column): CoordinateDraft => {
    const name = coordinateNameFrom(column);
    const angle = unitOf(column) === 'rad' || unitOf(column) === 'deg' || angleName.test(name) || /angle/i.test(name);
    const unit = unitOf(column) ?? (angle ? 'rad' : 'm');
    const force = forces.get(column) ?? '';
    return {
      name,
      column,
      unit,
      velocity: { column: velocities.get(column) ?? '', unit: `${unit}/s` },
      force: { column: force, unit: (force && unitOf(force)) || (angle ? 'N*m' : 'N') },
    };
  });
  return { timeColumn, coordinates };
}

/** What each mapped column is, for the preview's header. */
export function columnRoles(mapping: RecordingMappingInput): Record<string, string> {
  const roles: Record<string, string> = {};
  if (mapping.time.column) roles[mapping.time.column] = 'time';
  for (const c of mapping.coordinates) {
    if (c.column) roles[c.column] = `position of ${c.name || '?'}`;
    if (c.velocity?.column) roles[c.velocity.column] = `velocity of ${c.name || '?'}`;
    if (c.force?.column) roles[c.force.column] = `force on ${c.name || '?'}`;
  }
  return roles;
}
