// A React wrapper around one ECharts instance (SVG renderer), resized with its box.
// `onPointer` reports the data coordinates under the pointer (for a crosshair read-out);
// `onItemClick` reports a clicked data item. The box gets data-drawn once the series are drawn.
import { useEffect, useRef } from 'react';
import type { EChartsCoreOption } from 'echarts/core';
import { echarts } from './echarts-setup.js';

export interface PointerAt {
  /** Plot frame (panel) under the pointer. */
  grid: number;
  x: number;
  y: number;
}

interface Props {
  option: EChartsCoreOption;
  height?: number;
  label: string;
  testId?: string;
  onPointer?: (at: PointerAt | null) => void;
  onItemClick?: (item: { seriesIndex: number; dataIndex: number; data: unknown }) => void;
}

export function EChart({ option, height = 460, label, testId = 'chart', onPointer, onItemClick }: Props) {
  const box = useRef<HTMLDivElement>(null);
  const chart = useRef<echarts.ECharts | null>(null);
  const handlers = useRef({ onPointer, onItemClick });
  handlers.current = { onPointer, onItemClick };

  useEffect(() => {
    const el = box.current!;
    const instance = echarts.init(el, null, { renderer: 'svg' });
    chart.current = instance;
    const observer = new ResizeObserver(() => instance.resize());
    observer.observe(el);
    const zr = instance.getZr();
    const move = (e: { offsetX: number; offsetY: number }) => {
      const report = handlers.current.onPointer;
      if (!report) return;
      const grids = ((instance.getOption()?.grid as unknown[] | undefined) ?? []).length;
      for (let k = 0; k < grids; k++) {
        const px = [e.offsetX, e.offsetY];
        if (instance.containPixel({ gridIndex: k }, px)) {
          const [x, y] = instance.convertFromPixel({ gridIndex: k }, px) as number[];
          return report({ grid: k, x, y });
        }
      }
      report(null);
    };
    const out = () => handlers.current.onPointer?.(null);
    zr.on('mousemove', move);
    zr.on('globalout', out);
    // data-drawn: the series are on screen (renderer-agnostic; large series are one path).
    instance.on('finished', () => {
      const series = (instance.getOption()?.series as unknown[] | undefined) ?? [];
      if (series.length) el.dataset.drawn = 'true';
    });
    instance.on('click', (p) => handlers.current.onItemClick?.({ seriesIndex: p.seriesIndex ?? -1, dataIndex: p.dataIndex, data: p.data }));
    return () => {
      observer.disconnect();
      instance.dispose();
      chart.current = null;
    };
  }, []);

  useEffect(() => {
    chart.current?.setOption(option, { notMerge: true });
  }, [option]);

  useEffect(() => {
    chart.current?.resize();
  }, [height]);

  return <div ref={box} role="img" aria-label={label} style={{ height }} className="w-full" data-testid={testId} />;
}
