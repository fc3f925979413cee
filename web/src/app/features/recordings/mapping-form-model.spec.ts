import type { RecordingInspection } from '../../../../../shared/schemas/recording';
import { coordinateNameFrom, suggestMapping, toMapping } from './mapping-form-model';

function inspection(header: string[], numeric = header, suggestedTimeColumn: string | null = header[0] ?? null): RecordingInspection {
  return { fileName: 'run.csv', sizeBytes: 100, header, rowCount: 3, previewRows: [], numericColumns: numeric, suggestedTimeColumn };
}

describe('suggestMapping', () => {
  it('puts a force column on the coordinate whose column shares its name, units from name suffixes', () => {
    const guess = suggestMapping(inspection(['t_s', 'cart_x_m', 'pole_angle_rad', 'cart_force_N']));
    expect(guess.timeColumn).toBe('t_s');
    expect(guess.coordinates.map((c) => [c.name, c.column, c.unit, c.force.column, c.force.unit])).toEqual([
      ['cart_x', 'cart_x_m', 'm', 'cart_force_N', 'N'],
      ['pole_angle', 'pole_angle_rad', 'rad', '', 'N*m'],
    ]);
  });

  it('reads d<name> columns as measured velocities and u_<name> as forces', () => {
    const guess = suggestMapping(inspection(['time', 'x', 'th', 'dx', 'dth', 'u_x']));
    expect(guess.coordinates.map((c) => [c.name, c.velocity.column, c.force.column])).toEqual([
      ['x', 'dx', 'u_x'],
      ['th', 'dth', ''],
    ]);
    expect(guess.coordinates[1]!.unit).toBe('rad');
  });

  it('leaves columns with text cells out of the guess', () => {
    const guess = suggestMapping(inspection(['t', 'x', 'note'], ['t', 'x']));
    expect(guess.coordinates.map((c) => c.column)).toEqual(['x']);
  });
});

describe('coordinateNameFrom', () => {
  it('makes a term symbol of any column name', () => {
    expect(coordinateNameFrom('Arm angle [rad]')).toBe('Arm_angle');
    expect(coordinateNameFrom('2nd link')).toBe('q_2nd_link');
  });
});

describe('toMapping', () => {
  it('leaves out velocity and force columns that were not chosen', () => {
    const mapping = toMapping({
      name: '',
      time: { column: 't', unit: 's' },
      coordinates: [{ name: 'x', column: 'x', unit: 'm', velocity: { column: '', unit: 'm/s' }, force: { column: 'u', unit: 'N' } }],
    });
    expect(mapping.coordinates[0]).toEqual({ name: 'x', column: 'x', unit: 'm', force: { column: 'u', unit: 'N' } });
  });
});
