import { stepPerformerLabels, type StepPerformer } from './travelers';

/**
 * Work credited to someone other than the builder, in the words every screen and export uses: "a helper,
 * Sam Ortiz". Null for the builder's own work, which needs no words.
 */
export function helpWords(by: StepPerformer | null | undefined, name?: string | null): string | null {
  if (!by || by === 'builder') return null;
  return `${stepPerformerLabels[by].toLowerCase()}${name ? `, ${name}` : ''}`;
}

/** A person in a list of hours, with whose work it was when not the builder's: "Sam Ortiz (a helper)". */
export const whoWithHelp = (who: string, by: StepPerformer) =>
  by === 'builder' ? who : `${who} (${stepPerformerLabels[by].toLowerCase()})`;
