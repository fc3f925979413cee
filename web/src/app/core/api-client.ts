import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, firstValueFrom } from 'rxjs';
import type { z } from 'zod';
import { ApiFailure, toApiFailure } from './api-failure';

/**
 * The one door to `/api`: every answer is checked against its shared schema before a page sees it, and every
 * failure arrives as an ApiFailure.
 */
@Injectable({ providedIn: 'root' })
export class ApiClient {
  private readonly http = inject(HttpClient);

  get<T>(path: string, answer: z.ZodType<T>): Promise<T> {
    return this.send(this.http.get(apiUrl(path)), answer);
  }

  post<T>(path: string, body: unknown, answer: z.ZodType<T>): Promise<T> {
    return this.send(this.http.post(apiUrl(path), body), answer);
  }

  async delete(path: string): Promise<void> {
    await this.receive(this.http.delete(apiUrl(path)));
  }

  private async send<T>(request: Observable<unknown>, answer: z.ZodType<T>): Promise<T> {
    const body = await this.receive(request);
    const parsed = answer.safeParse(body);
    if (!parsed.success) {
      throw new ApiFailure(200, 'unexpected_answer', 'The server sent an answer this page does not understand. Reload the page; if it persists, tell your admin.');
    }
    return parsed.data;
  }

  private async receive(request: Observable<unknown>): Promise<unknown> {
    try {
      return await firstValueFrom(request, { defaultValue: null });
    } catch (err) {
      throw toApiFailure(err);
    }
  }
}

function apiUrl(path: string): string {
  return `/api${path.startsWith('/') ? path : `/${path}`}`;
}
