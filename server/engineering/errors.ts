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

/**
 * The same refusal with its field placed inside a larger input ("inputs" + "lines[1].name" →
 * "inputs.lines.1.name"): the engine names fields relative to what it was given, the API names them
 * from the root of the request body in the dotted form its contracts (zod) use, so one form can put
 * every message next to its box.
 */
export function fieldAt(prefix: string, field: string): string {
  const dotted = field.replace(/\[(\d+)\]/g, '.$1');
  return prefix ? `${prefix}.${dotted}` : dotted;
}
