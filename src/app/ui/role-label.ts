import { Pipe, PipeTransform } from '@angular/core';
import { ROLE_LABELS, type Role } from '../../../shared/authz/roles';

@Pipe({ name: 'roleLabel' })
export class RoleLabelPipe implements PipeTransform {
  transform(role: string): string {
    return ROLE_LABELS[role as Role] ?? role;
  }
}
