import { DiscoveryInputError } from './discovery-input-error.js';
import { reservedNameReason } from './restricted-math.js';

/** What a symbol in an expression stands for: coordinate i, its velocity, or its acceleration. */
export interface SymbolMeaning {
  kind: 'coordinate' | 'velocity' | 'acceleration';
  index: number;
}

/**
 * The symbols of a mechanism with coordinates (q_1..q_n): each name `x`, its velocity `dx` and its
 * acceleration `ddx`. Built once per description; `lookup` answers what a name in a term means.
 */
export class TermSymbols {
  readonly coordinates: readonly string[];
  private readonly meanings = new Map<string, SymbolMeaning>();

  constructor(coordinates: readonly string[]) {
    checkCoordinateNames(coordinates);
    this.coordinates = [...coordinates];
    coordinates.forEach((name, index) => {
      this.meanings.set(name, { kind: 'coordinate', index });
      this.meanings.set(velocityName(name), { kind: 'velocity', index });
      this.meanings.set(accelerationName(name), { kind: 'acceleration', index });
    });
  }

  lookup(name: string): SymbolMeaning | undefined {
    return this.meanings.get(name);
  }

  get velocities(): string[] {
    return this.coordinates.map(velocityName);
  }

  get accelerations(): string[] {
    return this.coordinates.map(accelerationName);
  }
}

export function velocityName(coordinate: string): string {
  return `d${coordinate}`;
}

export function accelerationName(coordinate: string): string {
  return `dd${coordinate}`;
}

const identifier = /^[A-Za-z][A-Za-z0-9_]*$/;
const functionNames = ['sin', 'cos'];

/**
 * Refuses coordinate names that would make expressions ambiguous: not an identifier, a function or constant
 * of the notation, a duplicate, or a name that is another coordinate's velocity or acceleration (`x` and `dx`).
 */
export function checkCoordinateNames(coordinates: readonly string[]): void {
  if (coordinates.length === 0) throw new DiscoveryInputError('Name at least one coordinate.');
  const seen = new Set<string>();
  for (const name of coordinates) {
    if (!identifier.test(name)) {
      throw new DiscoveryInputError(
        `Coordinate name "${name}" is not usable in expressions: use a letter followed by letters, digits or _.`,
      );
    }
    const reserved = functionNames.includes(name) ? 'is a function of the expression notation' : reservedNameReason(name);
    if (reserved) {
      throw new DiscoveryInputError(`Coordinate name "${name}" ${reserved}: choose another name (for example "${name}1").`);
    }
    if (seen.has(name)) throw new DiscoveryInputError(`Coordinate "${name}" is named twice.`);
    seen.add(name);
  }
  for (const name of coordinates) {
    for (const other of coordinates) {
      if (name === velocityName(other) || name === accelerationName(other)) {
        throw new DiscoveryInputError(
          `Coordinate name "${name}" clashes with the ${name === velocityName(other) ? 'velocity' : 'acceleration'} ` +
            `of coordinate "${other}" (written "${name}" in expressions): rename one of them.`,
        );
      }
    }
  }
}
