import { useMutation, useQueryClient, type QueryClient, type QueryKey } from '@tanstack/react-query';

/** Asks again for everything under each key, all at once. */
export function invalidateAll(qc: QueryClient, keys: readonly QueryKey[]) {
  return Promise.all(keys.map((queryKey) => qc.invalidateQueries({ queryKey })));
}

/** A change whose only follow-up is asking again for what it touched. */
export function useRefreshingMutation<R, V = void>(send: (v: V) => Promise<R>, refresh: readonly QueryKey[]) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: send, onSuccess: () => invalidateAll(qc, refresh) });
}

/**
 * A change to one record whose answer is the record as it now stands: the answer replaces the cached
 * record at once (or, with `removed`, the record leaves the cache), and the lists that show it are asked again.
 */
export function useRecordMutation<R, V = void>({
  record,
  send,
  refresh,
  removed = false,
}: {
  record: QueryKey;
  send: (v: V) => Promise<R>;
  refresh: readonly QueryKey[];
  removed?: boolean;
}) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: (answer) => {
      if (removed) qc.removeQueries({ queryKey: record });
      else qc.setQueryData(record, answer);
      return invalidateAll(qc, refresh);
    },
  });
}
