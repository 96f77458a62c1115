import { HttpEventType, HttpHeaders, HttpResponse } from '@angular/common/http';
import type { EphemerisSummary } from '../../../shared/api/ephemerides';
import { uploadProgress } from './ephemeris-api';

describe('uploadProgress', () => {
  it('reports the bytes sent while the file goes up, then processing once all are sent', () => {
    expect(uploadProgress({ type: HttpEventType.UploadProgress, loaded: 250, total: 1000 })).toEqual({ stage: 'sending', loaded: 250, total: 1000 });
    expect(uploadProgress({ type: HttpEventType.UploadProgress, loaded: 1000, total: 1000 })).toEqual({ stage: 'processing' });
  });

  it('keeps sending without a total (the browser may not know it)', () => {
    expect(uploadProgress({ type: HttpEventType.UploadProgress, loaded: 10 })).toEqual({ stage: 'sending', loaded: 10, total: null });
  });

  it('ends with the stored summary', () => {
    const summary = { id: 'e1', name: 'Kestrel-1', rows: 241 } as EphemerisSummary;
    const response = new HttpResponse({ body: summary, status: 201, headers: new HttpHeaders() });
    expect(uploadProgress(response)).toEqual({ stage: 'done', summary });
  });
});
