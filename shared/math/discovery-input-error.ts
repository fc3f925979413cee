/**
 * A problem with what the user asked for or supplied (a description, a recording, a term), as opposed to a
 * fault in the program. Its message is written for the person who made the input: it names the term, file,
 * row or column at fault. Callers at the edge turn it into a clear refusal (the command line exits with 2).
 */
export class DiscoveryInputError extends Error {
  override readonly name = 'DiscoveryInputError';
}
