/**
 * Registers only the Chart.js pieces Resetwise's charts use (tree-shaken; never `chart.js/auto`),
 * and sets the shared look: the app font, muted text and light grid lines. Import once per island.
 */
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  Title,
  Tooltip,
} from 'chart.js';

Chart.register(LineController, BarController, ScatterController, LineElement, PointElement, BarElement, LinearScale, CategoryScale, Legend, Tooltip, Title);

Chart.defaults.font.family = "'Noto Sans', ui-sans-serif, system-ui, sans-serif";
Chart.defaults.font.size = 12;
Chart.defaults.color = '#5c6761'; // --color-muted
Chart.defaults.borderColor = '#e6e9e5'; // a shade lighter than --color-line, for grid lines
Chart.defaults.plugins.tooltip.backgroundColor = 'rgba(30, 38, 34, 0.92)'; // --color-ink
Chart.defaults.plugins.tooltip.padding = 8;

export { Chart };
