import { useMemo } from 'react';
import type { KitModel, StudyDetail } from '@/db/contracts';
import { Screen } from '@/components/ui/screen';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { useKitsQuery } from '@/hooks/queries/kits';
import { useStudyQuery } from '@/hooks/queries/studies';
import { StudyForm } from './study-form';
import { newStudyValues, studyValues } from './study-form-values';
import { whenText } from './study-links';
import { StudyResults } from './study-results';
import { NewStudyShell, StudyDetailShell } from './study-shell';
import { WingStudyBody } from './wing-screen';

export { whenText };

/**
 * One load study: its inputs on the left, the computed revision's pictures and tables on the right; a
 * rib's or a whole wing's by the study's kind.
 */
export function StudyScreen({ studyId, revision }: { studyId: string; revision?: number }) {
  const q = useStudyQuery(studyId, revision);
  const kits = useKitsQuery();
  if (q.isPending || kits.isPending) {
    return (
      <Screen title="Load study" backTo="/studies">
        <LoadingState what={revision ? `Loading revision ${revision}` : 'Loading the study'} />
      </Screen>
    );
  }
  if (q.isError || kits.isError) {
    const error = q.error ?? kits.error;
    return (
      <Screen title="Load study" backTo="/studies">
        <ErrorState
          error={error}
          title={revision ? `Revision ${revision} did not load` : undefined}
          // Not found or not yours does not change by trying again.
          onRetry={
            error instanceof ApiError && (error.status === 404 || error.status === 403)
              ? undefined
              : () => {
                  void q.refetch();
                  void kits.refetch();
                }
          }
        />
      </Screen>
    );
  }
  return q.data.kind === 'wing' ? (
    <WingStudyBody d={q.data} kits={kits.data} />
  ) : (
    <StudyBody d={q.data} kits={kits.data} />
  );
}

function StudyBody({ d, kits }: { d: StudyDetail; kits: KitModel[] }) {
  const defaults = useMemo(() => studyValues(d), [d]);
  return (
    <StudyDetailShell
      d={d}
      testID="study-screen"
      leftWidth={0.4}
      form={(p) => <StudyForm kits={kits} defaultValues={defaults} {...p} />}
      results={(latest) => <StudyResults detail={d} latestRevision={latest} />}
    />
  );
}

/** A new load study: the inputs, and "Compute" makes revision 1. */
export function NewStudyScreen({ kitModelId }: { kitModelId?: string }) {
  return (
    <NewStudyShell
      kitModelId={kitModelId}
      title="New load study"
      subtitle="From weight, speeds and airfoil to rivet loads and a pitch schedule"
      testID="new-study-screen"
      needs="A load study works from a kit model's weight, wing, speeds and airfoil."
      promise={
        'Fill in the inputs and press Compute. You get the pressure on the rib for every flight condition, the load on each rivet ' +
        'against its allowables, the gauge and rivet trade table and the pitch zones, stored as revision 1.'
      }
      valuesFor={newStudyValues}
      form={(p) => <StudyForm {...p} />}
    />
  );
}
