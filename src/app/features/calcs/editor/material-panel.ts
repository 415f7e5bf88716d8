import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatIconModule } from '@angular/material/icon';
import { UNIT_LABELS, type UnitSystem } from '../../../../../shared/engine/units';
import {
  BASIS_LABELS,
  MATERIAL_LIBRARY,
  findMaterial,
  toMaterialInput,
  valueIn,
  type MaterialProperty,
} from '../../../../../shared/materials';
import type { EditorValue, MaterialForm } from './editor-form';
import type { IssueMap } from './issue-map';
import { convertedText, fromText } from './number-text';

const PROPS: [MaterialProperty, string, 'modulus' | 'stress' | null][] = [
  ['E', "Young's modulus E", 'modulus'],
  ['G', 'Shear modulus G', 'modulus'],
  ['nu', "Poisson's ratio ν", null],
  ['Sy', 'Yield strength Sy', 'stress'],
  ['Su', 'Ultimate strength Su', 'stress'],
];

const SHORT: Record<MaterialProperty, string> = { E: 'E', G: 'G', nu: 'ν', Sy: 'Sy', Su: 'Su' };

/** The calc material: picked from the sourced library or entered, with each value's origin shown. */
@Component({
  selector: 'tt-material-panel',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatIconModule],
  templateUrl: './material-panel.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialPanel {
  readonly group = input.required<FormGroup<MaterialForm>>();
  readonly value = input.required<EditorValue['material']>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();

  protected readonly library = MATERIAL_LIBRARY;
  protected readonly labels = computed(() => UNIT_LABELS[this.units()]);
  protected readonly entry = computed(() => findMaterial(this.value().libraryId));
  protected readonly fields = computed(() =>
    PROPS.map(([key, label, q]) => ({ key, label, unit: q ? this.labels()[q] : '' })),
  );

  /** Per value: where it comes from now. A library value the author changed is shown as entered. */
  protected readonly provenance = computed(() => {
    const e = this.entry();
    if (!e) return [];
    const rows = PROPS.map(([key, , q]) => {
      const lib = valueIn(e, key, this.units());
      const typed = fromText(this.value()[key]);
      const sourced = e[key];
      const isSame = lib !== null && typeof typed === 'number' && Math.abs(typed - lib) <= 1e-6 * Math.abs(lib);
      const unit = q ? this.labels()[q] : '';
      const origin = !sourced
        ? 'no sourced value: enter it with its source'
        : isSame
          ? `${sourced.source} · ${BASIS_LABELS[sourced.basis]}`
          : `entered by the author (library: ${convertedText(lib!)} ${unit}, ${BASIS_LABELS[sourced.basis]})`;
      return { key: key as string, label: SHORT[key], origin, isLibrary: isSame };
    });
    // Values with the same origin are listed together (E, G, ν: Table A-5 · typical value).
    return rows.reduce<typeof rows>((out, r) => {
      const last = out[out.length - 1];
      if (last && last.origin === r.origin)
        out[out.length - 1] = { ...last, key: last.key + r.key, label: `${last.label}, ${r.label}` };
      else out.push(r);
      return out;
    }, []);
  });

  protected issue(key: string): string | undefined {
    return this.issues()[`material.${key}`];
  }

  protected pick(id: string): void {
    const e = findMaterial(id);
    if (!e) return;
    const m = toMaterialInput(e, this.units());
    const t = (v: number | undefined) => (v === undefined ? '' : String(v));
    this.group().patchValue({
      libraryId: id,
      name: e.name,
      kind: e.kind,
      E: t(m.E),
      G: t(m.G),
      nu: t(m.nu),
      Sy: t(m.Sy),
      Su: t(m.Su),
      source: m.source ?? '',
    });
  }
}
