import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** Torquetrail's mark: a stepped shaft with a twist arc over it. Same drawing as public/logo.svg. */
@Component({
  selector: 'tt-logo-mark',
  template: `
    <svg [attr.width]="size()" [attr.height]="size()" viewBox="0 0 64 64" aria-hidden="true" focusable="false">
      <rect width="64" height="64" rx="14" fill="#0f2a30" />
      <rect x="8" y="27" width="14" height="10" rx="1.5" fill="#e8dcc4" />
      <rect x="21" y="23" width="22" height="18" rx="2" fill="#e8dcc4" />
      <rect x="42" y="28" width="14" height="8" rx="1.5" fill="#e8dcc4" />
      <path d="M14 20 A22 14 0 0 1 50 18" fill="none" stroke="#e0913a" stroke-width="4" stroke-linecap="round" />
      <path d="M50 18 l-7 -3 l2.5 7 z" fill="#e0913a" />
      <line x1="21" y1="47" x2="43" y2="47" stroke="#7fb5ad" stroke-width="2.5" stroke-linecap="round" />
    </svg>
  `,
  styles: ':host { display: inline-flex; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LogoMark {
  readonly size = input(32);
}
