import type { EditorForm } from './editor-form';

/*
 * About how tall each panel of the workbench will be once built (px at 1440 px wide, measured on the demo calcs:
 * heading and buttons plus one band per row), kept for it while it waits so the page below does not jump. Narrower
 * screens wrap rows and grow a little more when the panel is built, below the place being read.
 */
export function placeholderHeights(form: EditorForm) {
  const c = form.controls;
  return {
    features: 80 + 260 * c.features.length,
    supports: 80 + 223 * c.supports.length,
    loads: 246 + 130 * c.torques.length + 130 * c.bending.length,
    forces: 80 + 245 * c.loads.length,
    dynamics: 150 + 75 * c.masses.length,
  };
}
