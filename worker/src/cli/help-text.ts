/** What `conserva --help` prints. */
export const helpText = `conserva: find the energy and Lagrangian of a mechanism from recorded motion

Usage:
  conserva discover <description.json> [--json] [--model-out <model.json>]
  conserva simulate <model.json> <recording.csv> [--json] [--threshold <error>]
                    [--columns <name>=<column>,...] [--forces cubic|linear|hold] [--points <count>]
  conserva --help

discover reads a sweep description, tries every subset of candidate terms in the size range it
asks for, and prints the leaderboard of energies with their Lagrangians. With --json it prints
one JSON object on standard output instead of a table. Progress goes to standard error.
--model-out also writes the best model as a model document (format conserva-model, version 1).

simulate derives the equations of motion of a model document from its Lagrangian, drives them
through a recording from its initial state with its recorded generalized forces, and prints the
simulated trajectory, the error against the recording and the mass-matrix check.
  columns     default: "time", a column named like each coordinate, its velocity d<name> if
              present (else estimated), its force u_<name> if present (else zero); --columns
              maps other names, e.g. --columns time=t,th=angle,u_th=torque
  --threshold error in coordinate units after which the model counts as lost (default 0.05)
  --forces    how forces are read between samples (default cubic; hold for a digital
              controller's output)
  --points    thin the printed trajectory to at most this many samples (default every sample)

Exit status: 0 on success, 2 when an input (description, model, recording, option) is invalid,
1 on any other fault.

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
