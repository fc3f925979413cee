import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import {
  type ApplicationConfig,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { MAT_ICON_DEFAULT_OPTIONS } from '@angular/material/icon';
import { TitleStrategy, provideRouter, withComponentInputBinding } from '@angular/router';
import { routes } from './app.routes';
import { csrfCookieName, csrfHeaderName, csrfInterceptor } from './core/csrf-interceptor';
import { PageTitle } from './core/page-title';
import { Session } from './core/session';
import { sessionExpiryInterceptor } from './core/session-expiry-interceptor';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding()),
    { provide: TitleStrategy, useClass: PageTitle },
    // No withFetch(): only the XHR backend reports upload progress.
    provideHttpClient(
      withXsrfConfiguration({ cookieName: csrfCookieName, headerName: csrfHeaderName }),
      withInterceptors([csrfInterceptor, sessionExpiryInterceptor]),
    ),
    provideAppInitializer(() => inject(Session).restore()),
    { provide: MAT_ICON_DEFAULT_OPTIONS, useValue: { fontSet: 'material-symbols-outlined' } },
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline', subscriptSizing: 'dynamic' } },
  ],
};
