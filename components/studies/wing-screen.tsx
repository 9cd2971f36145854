import { useMemo } from 'react';
import type { KitModel, StudyDetail } from '@/db/contracts';
import { NewStudyShell, StudyDetailShell } from './study-shell';
import { WingForm } from './wing-form';
import { newWingValues, wingValues } from './wing-form-values';
import { WingResults } from './wing-results';

/** A whole-wing study: its inputs on the left, the computed revision on the right (one at a time on a phone). */
export function WingStudyBody({ d, kits }: { d: StudyDetail; kits: KitModel[] }) {
  const defaults = useMemo(() => wingValues(d), [d]);
  return (
    <StudyDetailShell
      d={d}
      testID="wing-study-screen"
      kindLabel="Wing study"
      // The results' tables are wide: they get two thirds of the screen.
      leftWidth={0.3}
      form={(p) => <WingForm kits={kits} defaultValues={defaults} {...p} />}
      results={(latest) => <WingResults detail={d} latestRevision={latest} />}
    />
  );
}

/** A new whole-wing study: the inputs, and "Compute" makes revision 1. */
export function NewWingStudyScreen({ kitModelId }: { kitModelId?: string }) {
  return (
    <NewStudyShell
      kitModelId={kitModelId}
      title="New wing study"
      subtitle="Every rib and skin panel, root to tip, from the kit's loads"
      testID="new-wing-study-screen"
      needs="A wing study works from a kit model's weight, wing, speeds and airfoil."
      promise={
        'Fill in the inputs and press Compute. You get the loads at every rib (shear, bending, torque), each rib’s gauge, rivet ' +
        'and pitch zones, every skin panel’s with its buckling margins, and the trade of one gauge and rivet for every rib against ' +
        'each its own, stored as revision 1.'
      }
      valuesFor={newWingValues}
      form={(p) => <WingForm {...p} />}
    />
  );
}
