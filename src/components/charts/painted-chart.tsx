import ReactEChartsCore from 'echarts-for-react/esm/core';
import { echarts } from './echarts';
import { useAfterPaint } from './use-after-paint';

/**
 * An ECharts chart as one labelled image, built only once the page around it has painted
 * (see useAfterPaint), with an empty box of the same height until then so nothing shifts.
 */
export function PaintedChart({
  option,
  height,
  ariaLabel,
}: {
  /** An ECharts option object; the options built here are not typed against ECharts' own. */
  option: object;
  height: number;
  ariaLabel: string;
}) {
  const ready = useAfterPaint();
  return (
    <div role="img" aria-label={ariaLabel}>
      {ready ? (
        <ReactEChartsCore
          echarts={echarts}
          option={option}
          notMerge
          lazyUpdate
          style={{ height, width: '100%' }}
        />
      ) : (
        <div style={{ height, width: '100%' }} />
      )}
    </div>
  );
}
