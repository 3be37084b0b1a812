// A React wrapper around one ECharts instance (SVG renderer), resized with its box.
import { useEffect, useRef } from 'react';
import type { EChartsCoreOption } from 'echarts/core';
import { echarts } from './echarts-setup.js';

export function EChart({ option, height = 460, label }: { option: EChartsCoreOption; height?: number; label: string }) {
  const box = useRef<HTMLDivElement>(null);
  const chart = useRef<echarts.ECharts | null>(null);

  useEffect(() => {
    const el = box.current!;
    const instance = echarts.init(el, null, { renderer: 'svg' });
    chart.current = instance;
    const observer = new ResizeObserver(() => instance.resize());
    observer.observe(el);
    return () => {
      observer.disconnect();
      instance.dispose();
      chart.current = null;
    };
  }, []);

  useEffect(() => {
    chart.current?.setOption(option, { notMerge: true });
  }, [option]);

  return <div ref={box} role="img" aria-label={label} style={{ height }} className="w-full" data-testid="chart" />;
}
