/**
 * Thrown by the pure computations when an input has no meaningful answer (a grade that no
 * standard defines, a hardness outside the conversion table, a wheel setup the blade cannot
 * reach). `field` names the input at fault, so the server can report it as a validation issue
 * and a form can show it beside the right box.
 */
export class ComputationError extends Error {
  constructor(
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'ComputationError';
  }
}
