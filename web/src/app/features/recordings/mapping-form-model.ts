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
const forcePrefix = /^(u|f|force|tau|torque)_?(.+)$/i;
const velocityPattern = [/^d(.+)$/, /^(.+)_?dot$/i, /^v_?(.+)$/i, /^omega_?(.+)$/i];

/** A coordinate name from a column name: letters, digits and _ only, starting with a letter. */
export function coordinateNameFrom(column: string): string {
  const cleaned = column.replace(/\[.*?\]|\(.*?\)/g, '').trim().replace(/[^A-Za-z0-9_]+/g, '_').replace(/^_+|_+$/g, '');
  return /^[A-Za-z]/.test(cleaned) ? cleaned.slice(0, 40) : `q_${cleaned}`.slice(0, 40);
}

/**
 * A first guess at the mapping from the file alone: the suggested time column, `u_<name>`-like columns as
 * forces, `d<name>`-like columns as velocities, every other numeric column a coordinate. Angle-like names get
 * radians, others metres. The user corrects what is wrong.
 */
export function suggestMapping(inspection: RecordingInspection): { timeColumn: string; coordinates: CoordinateDraft[] } {
  const numeric = inspection.numericColumns;
  const timeColumn = inspection.suggestedTimeColumn ?? numeric[0] ?? inspection.header[0] ?? '';
  const rest = numeric.filter((c) => c !== timeColumn);
  const forces = new Map<string, string>();
  for (const column of rest) {
    const match = forcePrefix.exec(column);
    if (match && rest.includes(match[2]!)) forces.set(match[2]!, column);
  }
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
  const taken = new Set([...forces.values(), ...velocities.values()]);
  const coordinates = rest
    .filter((column) => !taken.has(column))
    .slice(0, 8)
    .map((column): CoordinateDraft => {
      const name = coordinateNameFrom(column);
      const angle = angleName.test(name);
      return {
        name,
        column,
        unit: angle ? 'rad' : 'm',
        velocity: { column: velocities.get(column) ?? '', unit: angle ? 'rad/s' : 'm/s' },
        force: { column: forces.get(column) ?? '', unit: angle ? 'N*m' : 'N' },
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
