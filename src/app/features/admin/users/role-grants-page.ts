import { ChangeDetectionStrategy, Component } from '@angular/core';
import { PendingGrants } from './pending-grants';

/** Where compliance officers (and administrators) confirm or refuse signing roles asked for others. */
@Component({
  selector: 'tt-role-grants-page',
  imports: [PendingGrants],
  template: `
    <div class="tt-page">
      <div class="tt-page-head">
        <div>
          <div class="tt-kicker">Separation of duties</div>
          <h1>Role confirmations</h1>
        </div>
      </div>
      <section class="tt-sheet box" aria-labelledby="grants-title"><tt-pending-grants /></section>
    </div>
  `,
  styles: `
    .box {
      padding: 16px;
      max-width: 760px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RoleGrantsPage {}
