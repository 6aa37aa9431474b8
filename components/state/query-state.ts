/**
 * The part of a react-query result a view needs. Routes pass their hook's result straight
 * in (UseQueryResult fits), so components stay free of fetching and query keys.
 */
export type QueryState<T> = {
  status: 'pending' | 'error' | 'success';
  data: T | undefined;
  error: unknown;
  isFetching: boolean;
  refetch: () => unknown;
};
