import { HttpErrorResponse } from '@angular/common/http';
import type { ErrorBody, ErrorDetail } from '../../../shared/api/errors';
import { pathWords, withoutIdentifiers } from '../shell/user-words';

// The schema in shared/api/errors.ts is the contract; a type guard here instead of zod keeps zod
// out of the client's initial bundle for the sake of one check.
function isErrorBody(value: unknown): value is ErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error: unknown = value.error;
  return (
    typeof error === 'object' &&
    error !== null &&
    'message' in error &&
    typeof error.message === 'string'
  );
}

function describeDetail(detail: ErrorDetail): string {
  const where = detail.row !== undefined ? `row ${detail.row}${detail.column ? `, ${detail.column}` : ''}` : detail.path && pathWords(detail.path);
  return where ? `${where}: ${detail.message}` : detail.message;
}

/**
 * One sentence for the user from whatever an API call failed with: the server's own message
 * (it names the field and the value), followed by its details when they add something.
 */
export function apiErrorMessage(failure: unknown): string {
  if (failure instanceof HttpErrorResponse) {
    if (isErrorBody(failure.error)) {
      const { message, details } = failure.error.error;
      // A detail for the field the message already opens with ("frame: ...") would say it twice.
      const extra = (details ?? [])
        .filter((d) => !(d.path && d.row === undefined && message.startsWith(`${d.path}:`)))
        .map(describeDetail)
        .filter((d) => !message.includes(d));
      // The server names fields by their API path; the screen says them as the forms label them.
      return withoutIdentifiers(extra.length > 0 ? `${message} (${extra.join('; ')})` : message);
    }
    if (failure.status === 0) {
      return 'The server cannot be reached. Check the connection and try again.';
    }
    return `The server answered ${failure.status}${failure.statusText ? ` ${failure.statusText}` : ''} without an explanation.`;
  }
  if (failure instanceof Error) return failure.message;
  return 'Something went wrong.';
}
