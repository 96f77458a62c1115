import { Observable, catchError, map, of, startWith } from 'rxjs';
import { apiErrorMessage } from './api-error-message';

/** What a page shows for data it fetches: still coming, here, or a message saying why not. */
export type Loaded<T> =
  | { readonly status: 'loading' }
  | { readonly status: 'ready'; readonly value: T }
  | { readonly status: 'failed'; readonly message: string };

/** Turns an HTTP call into a stream of Loaded states, so a page converts it to a signal once. */
export function loaded<T>() {
  return (source: Observable<T>): Observable<Loaded<T>> =>
    source.pipe(
      map((value): Loaded<T> => ({ status: 'ready', value })),
      catchError((failure: unknown) => of<Loaded<T>>({ status: 'failed', message: apiErrorMessage(failure) })),
      startWith<Loaded<T>>({ status: 'loading' }),
    );
}
