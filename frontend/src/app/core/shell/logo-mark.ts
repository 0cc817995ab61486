import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Rillmark's mark: a droplet crossed by contour lines (water meeting the lie of the land). Decorative. */
@Component({
  selector: 'rm-logo-mark',
  template: `
    <svg viewBox="0 0 32 32" width="32" height="32" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="8" fill="#00363e" />
      <path d="M16 4.5C13.2 8.4 9 13.9 9 18.6a7 7 0 0 0 14 0c0-4.7-4.2-10.2-7-14.1z" fill="#91d1de" />
      <path
        d="M5 19.5c3.6-2.2 6.6 1.9 10.6-.2s6.6-2.6 11.4.3"
        fill="none"
        stroke="#00363e"
        stroke-width="1.7"
        stroke-linecap="round"
      />
      <path
        d="M5 24.2c3.6-2.2 6.6 1.9 10.6-.2s6.6-2.6 11.4.3"
        fill="none"
        stroke="#e0b46a"
        stroke-width="1.7"
        stroke-linecap="round"
      />
    </svg>
  `,
  styles: `
    :host {
      display: inline-flex;
      line-height: 0;
    }
    svg {
      border-radius: 8px;
      box-shadow: 0 0 0 1px rgb(255 255 255 / 0.25);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LogoMark {}
