// Chart files (SVG, PNG) for memos: the option is drawn again off screen at a fixed
// size with its title, subtitle and caution, then saved through a download link.
import type { EChartsCoreOption } from 'echarts/core';
import { CAUTION } from '../../../shared/export/caution.js';
import type { RunInfo } from '../api/types.js';
import { echarts } from '../components/echarts-setup.js';

/** The title, subtitle and caution that go on an exported chart of a run. */
export function exportTitle(run: RunInfo, what: string) {
  return {
    text: `${run.title ?? run.study}: ${what}`,
    subtext: `Filmsweep run #${run.id} · study ${run.study} v${run.study_version} (sha256 ${run.yaml_hash.slice(0, 12)}) · ${run.status}${run.git_commit ? ` · commit ${run.git_commit.slice(0, 10)}` : ''}`,
    footer: CAUTION,
  };
}

export function downloadDataUrl(url: string, filename: string) {
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
}

export function exportChart(option: EChartsCoreOption, type: 'svg' | 'png', filename: string, size = { width: 1200, height: 760 }) {
  const el = document.createElement('div');
  el.style.cssText = `position:fixed;left:-10000px;top:0;width:${size.width}px;height:${size.height}px`;
  document.body.appendChild(el);
  const chart = echarts.init(el, null, { renderer: type === 'svg' ? 'svg' : 'canvas', width: size.width, height: size.height });
  try {
    chart.setOption({ ...option, backgroundColor: '#ffffff' });
    const url = chart.getDataURL({ type, pixelRatio: type === 'png' ? 2 : 1, backgroundColor: '#ffffff' });
    downloadDataUrl(url, filename);
  } finally {
    chart.dispose();
    el.remove();
  }
}
