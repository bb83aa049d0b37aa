import { HttpClient, HttpEventType } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { filter, map, type Observable } from 'rxjs';
import type { CommitRequest, CommitResult, ImportPreview, PreviewChange } from '@shared/contracts/imports';
import { StudioContext } from '../core/studio-context';

export type UploadEvent = { kind: 'progress'; fraction: number } | { kind: 'done'; preview: ImportPreview };

/** Writes of the imports area; reads go through httpResource in the components. */
@Injectable({ providedIn: 'root' })
export class ImportsApi {
  private readonly http = inject(HttpClient);
  private readonly context = inject(StudioContext);

  url(path = ''): string {
    return `${this.context.base()}/imports${path}`;
  }

  /** Uploads one file, reporting the share of bytes sent, then the preview. */
  upload(file: File): Observable<UploadEvent> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<ImportPreview>(this.url(), body, { reportProgress: true, observe: 'events' }).pipe(
      map((event): UploadEvent | null => {
        if (event.type === HttpEventType.UploadProgress) {
          return { kind: 'progress', fraction: event.total ? event.loaded / event.total : 0 };
        }
        if (event.type === HttpEventType.Response && event.body) return { kind: 'done', preview: event.body };
        return null;
      }),
      filter((event): event is UploadEvent => event !== null),
    );
  }

  changePreview(importId: number, change: PreviewChange): Observable<ImportPreview> {
    return this.http.patch<ImportPreview>(this.url(`/${importId}`), change);
  }

  commit(importId: number, request: CommitRequest): Observable<CommitResult> {
    return this.http.post<CommitResult>(this.url(`/${importId}/commit`), request);
  }

  remove(importId: number): Observable<void> {
    return this.http.delete<void>(this.url(`/${importId}`));
  }
}
