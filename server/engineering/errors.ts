/**
 * The one error the engineering core throws for inputs that make no physical sense. `field` is a path
 * into the input ("kit.weightLb", "airfoil.points") so the server and the form can put the message next
 * to the right box; `reason` is a plain sentence for the person who typed it.
 */
export class EngineeringInputError extends Error {
  readonly field: string;
  readonly reason: string;

  constructor(field: string, reason: string) {
    super(`${field}: ${reason}`);
    this.name = 'EngineeringInputError';
    this.field = field;
    this.reason = reason;
  }
}
