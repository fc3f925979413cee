import type { Routes } from '@angular/router';
export const adminRoutes: Routes = [];
