// The parts of ECharts the dashboard uses, registered once (keeps the bundle small).
import * as echarts from 'echarts/core';
import { LineChart, ScatterChart } from 'echarts/charts';
import { AxisPointerComponent, GraphicComponent, GridComponent, LegendComponent, MarkLineComponent, TitleComponent, TooltipComponent } from 'echarts/components';
import { CanvasRenderer, SVGRenderer } from 'echarts/renderers';

// MarkLine: the rules that mark where a target was not reached.
echarts.use([LineChart, ScatterChart, GridComponent, AxisPointerComponent, LegendComponent, MarkLineComponent, TitleComponent, TooltipComponent, GraphicComponent, CanvasRenderer, SVGRenderer]);

export { echarts };
