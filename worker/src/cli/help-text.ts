/** What `conserva --help` prints. */
export const helpText = `conserva: find the energy and Lagrangian of a mechanism from recorded motion

Usage:
  conserva discover <description.json> [--json]
  conserva --help

discover reads a sweep description, tries every subset of candidate terms in the size range it
asks for, and prints the leaderboard of energies with their Lagrangians. With --json it prints
one JSON object on standard output instead of a table. Progress goes to standard error.
Exit status: 0 on success, 2 when the description or a recording is invalid, 1 on any other fault.

The description is JSON:
  coordinates   names of the generalized coordinates, e.g. ["th"]; velocities are written
                d<name> (dth), accelerations dd<name>
  recordings    [{"file": "run1.csv", "role": "train" | "validate"}], CSV files with a header row,
                relative to the description's folder
  columns       {"time": "t", "<coordinate>": "<column>", "d<coordinate>": "<velocity column>",
                 "forces": {"<coordinate>": "<generalized force column>"}}; velocities and forces
                are optional
  terms         candidate terms in ordinary notation: numbers, the symbols, + - * / ^ (whole
                powers), sin, cos; e.g. ["dth^2", "cos(th)", "dth^2*cos(th)"]
  generate      instead of terms: generator options {polynomialDegree, angles, trigonometric,
                differences, velocityDegree, kineticFactors, kineticPolynomialDegree, add, remove}
  known         terms in every model (default none)
  sizes         {"min": 0, "max": 3}: how many candidate terms beyond the known ones
  form          "balance" (default: energy change over windows against the integrated power) or
                "derivative" (energy rate against the power; needs accelerations)
  reference     {"term": "dth^2", "coefficient": 0.5}: a term with a fixed coefficient, required
                when the recordings carry no forces
  top           leaderboard length (default 10)
  derivatives   {"method": "savitzky-golay", "window": 9, "order": 4} (default) or
                {"method": "central"}
  balance       {"window": 20, "stride": 5, "integration": "simpson" | "trapezoid"}, in sample
                intervals (defaults shown)
`;
