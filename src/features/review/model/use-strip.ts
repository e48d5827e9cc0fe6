import { useQuery } from '@tanstack/react-query';
import type { ReviewDetail, Trace } from '../../../../shared/analysis/review-detail';
import { localKeys } from '../../../api/local';
import { thinStrip } from '../../../lib/log-pipeline/pipeline';

/**
 * The flight strip's thinned throttle and collective. Flights analysed by this version carry
 * it in their detail; for older ones the analysis worker thins the effort trace, so the page's
 * thread never does.
 */
export function useStripTrace(flightId: string, detail: ReviewDetail): Trace | undefined {
  const { effort } = detail;
  // The detail is fixed for a flight id; the strip is keyed by that id like other worker results.
  // eslint-disable-next-line @tanstack/query/exhaustive-deps
  const thinned = useQuery({
    queryKey: localKeys.strip(flightId),
    queryFn: () =>
      thinStrip({
        t: effort.t,
        series: Object.fromEntries(
          ['throttle', 'collective'].flatMap((k) =>
            effort.series[k] ? [[k, effort.series[k]]] : [],
          ),
        ),
      }),
    enabled: detail.strip === undefined,
    staleTime: Infinity,
    networkMode: 'always',
  });
  return detail.strip ?? thinned.data;
}
