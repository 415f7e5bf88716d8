export { DiagramChart } from './diagram-chart';
export { ShaftDrawing } from './shaft-drawing';
