// Bad input to the science core throws ScienceInputError. `field` names the offending input
// (a property path such as "setups[3].foresightM") so a form can put the message beside it.
export class ScienceInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = "ScienceInputError";
    this.field = field;
  }
}
