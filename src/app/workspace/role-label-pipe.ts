import { Pipe, type PipeTransform } from '@angular/core';
import { roleLabels, type Role } from '../../../shared/api/plain-lists';

/** `{{ member.role | roleLabel }}`: a role as people say it ("Thermal engineer"), never its identifier. */
@Pipe({ name: 'roleLabel' })
export class RoleLabelPipe implements PipeTransform {
  transform(role: Role | null | undefined): string {
    return role ? roleLabels[role] : '';
  }
}
