import { HttpClient, HttpEventType, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, filter, firstValueFrom, map } from 'rxjs';
import type { z } from 'zod';
import { ApiFailure, toApiFailure } from './api-failure';

/** A step of an upload: how much of the body has gone out, then the checked answer. */
export type UploadStep<T> = { kind: 'progress'; sent: number; total: number | null } | { kind: 'done'; answer: T };

/**
 * The one door to `/api`: every answer is checked against its shared schema before a page sees it, and every
 * failure arrives as an ApiFailure.
 */
@Injectable({ providedIn: 'root' })
export class ApiClient {
  private readonly http = inject(HttpClient);

  get<T>(path: string, answer: z.ZodType<T>, params?: Record<string, string | number>): Promise<T> {
    return this.send(this.http.get(apiUrl(path), { params }), answer);
  }

  post<T>(path: string, body: unknown, answer: z.ZodType<T>): Promise<T> {
    return this.send(this.http.post(apiUrl(path), body), answer);
  }

  put<T>(path: string, body: unknown, answer: z.ZodType<T>): Promise<T> {
    return this.send(this.http.put(apiUrl(path), body), answer);
  }

  patch<T>(path: string, body: unknown, answer: z.ZodType<T>): Promise<T> {
    return this.send(this.http.patch(apiUrl(path), body), answer);
  }

  async delete(path: string): Promise<void> {
    await this.receive(this.http.delete(apiUrl(path)));
  }

  /**
   * Sends a multipart form and reports how much of it has gone out (the XHR backend's upload events), then
   * the answer checked against its schema. Errors arrive as ApiFailure.
   */
  upload<T>(path: string, form: FormData, answer: z.ZodType<T>): Observable<UploadStep<T>> {
    return new Observable<UploadStep<T>>((subscriber) => {
      const subscription = this.http
        .post(apiUrl(path), form, { reportProgress: true, observe: 'events' })
        .pipe(
          filter((event: HttpEvent<unknown>) => event.type === HttpEventType.UploadProgress || event.type === HttpEventType.Response),
          map((event): UploadStep<T> => {
            if (event.type === HttpEventType.UploadProgress) return { kind: 'progress', sent: event.loaded, total: event.total ?? null };
            if (event.type !== HttpEventType.Response) throw new Error('unreachable');
            return { kind: 'done', answer: checked(event.body, answer) };
          }),
        )
        .subscribe({
          next: (step) => subscriber.next(step),
          error: (err: unknown) => subscriber.error(toApiFailure(err)),
          complete: () => subscriber.complete(),
        });
      return () => subscription.unsubscribe();
    });
  }

  private async send<T>(request: Observable<unknown>, answer: z.ZodType<T>): Promise<T> {
    return checked(await this.receive(request), answer);
  }

  private async receive(request: Observable<unknown>): Promise<unknown> {
    try {
      return await firstValueFrom(request, { defaultValue: null });
    } catch (err) {
      throw toApiFailure(err);
    }
  }
}

function checked<T>(body: unknown, answer: z.ZodType<T>): T {
  const parsed = answer.safeParse(body);
  if (!parsed.success) {
    throw new ApiFailure(200, 'unexpected_answer', 'The server sent an answer this page does not understand. Reload the page; if it persists, tell your admin.');
  }
  return parsed.data;
}

/** The URL of an API path, for links the browser follows itself (downloads). */
export function apiUrl(path: string): string {
  return `/api${path.startsWith('/') ? path : `/${path}`}`;
}
