import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { isTick, useBenchQueue, type BenchAction } from '@/hooks/queries/bench-actions';

/** "3 ticks", "1 finding" or, of more than one kind, "3 changes". */
function waitingWords(waiting: BenchAction[]): string {
  const n = waiting.length;
  const word = waiting.every(isTick) ? 'tick' : waiting.every((a) => a.kind === 'finding') ? 'finding' : 'change';
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

/**
 * What the bench did that has not reached the server yet, and the last refusal of one: on one part (its
 * page), or on every part (the bench, where `partNames` names the part a refusal was on).
 */
export function UnsentNotices({
  travelerId,
  partNames,
  testIDPrefix,
}: {
  travelerId?: string;
  partNames?: ReadonlyMap<string, string>;
  testIDPrefix: string;
}) {
  const queue = useBenchQueue(travelerId);
  const parts = new Set(queue.waiting.map((a) => a.travelerId)).size;
  const where = travelerId ? '' : ` on ${parts === 1 ? 'one part' : `${parts} parts`}`;
  const refusedOn = !travelerId && queue.refused ? partNames?.get(queue.refused.travelerId) : undefined;
  return (
    <>
      {queue.waiting.length ? (
        <Notice tone="caution" testID={`${testIDPrefix}-waiting`}>
          {`${waitingWords(queue.waiting)}${where} waiting for signal: kept on this device and sent as soon as the server answers.`}
        </Notice>
      ) : null}
      {queue.refused ? (
        <Notice tone="error" testID={`${testIDPrefix}-refused`}>
          <Txt tone="error">{`${refusedOn ? `${refusedOn}: ` : ''}${queue.refused.message}`}</Txt>
          <Button
            label="OK"
            variant="quiet"
            compact
            onPress={queue.dismissRefused}
            testID={`dismiss-${testIDPrefix}-refused`}
          />
        </Notice>
      ) : null}
    </>
  );
}
