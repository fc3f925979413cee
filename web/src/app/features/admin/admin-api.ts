import { Injectable, inject } from '@angular/core';
import {
  type AllowanceList,
  type AllowanceStatus,
  type AllowanceUpdate,
  allowanceListSchema,
  allowanceStatusSchema,
} from '../../../../../shared/schemas/allowance';
import { type AuditEventView, auditEventListSchema } from '../../../../../shared/schemas/audit-event';
import { type MailboxMessage, mailboxListSchema } from '../../../../../shared/schemas/mailbox';
import { type AdminTeam, type TeamInput, adminTeamListSchema, adminTeamSchema } from '../../../../../shared/schemas/team-admin';
import {
  type AdminUser,
  type UserCreate,
  type UserUpdate,
  adminUserListSchema,
  adminUserSchema,
} from '../../../../../shared/schemas/user-admin';
import { type WorkerPresence, workerListSchema } from '../../../../../shared/schemas/worker-presence';
import { ApiClient } from '../../core/api-client';

/** The admin routes: users and roles, teams, allowances, the audit trail, the local mailbox and workers. */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly api = inject(ApiClient);

  async users(): Promise<AdminUser[]> {
    return (await this.api.get('/admin/users', adminUserListSchema)).users;
  }

  createUser(input: UserCreate): Promise<AdminUser> {
    return this.api.post('/admin/users', input, adminUserSchema);
  }

  updateUser(userId: string, update: UserUpdate): Promise<AdminUser> {
    return this.api.patch(`/admin/users/${userId}`, update, adminUserSchema);
  }

  deleteUser(userId: string): Promise<void> {
    return this.api.delete(`/admin/users/${userId}`);
  }

  async teams(): Promise<AdminTeam[]> {
    return (await this.api.get('/admin/teams', adminTeamListSchema)).teams;
  }

  createTeam(input: TeamInput): Promise<AdminTeam> {
    return this.api.post('/admin/teams', input, adminTeamSchema);
  }

  renameTeam(teamId: string, input: TeamInput): Promise<AdminTeam> {
    return this.api.patch(`/admin/teams/${teamId}`, input, adminTeamSchema);
  }

  deleteTeam(teamId: string): Promise<void> {
    return this.api.delete(`/admin/teams/${teamId}`);
  }

  allowances(): Promise<AllowanceList> {
    return this.api.get('/admin/allowances', allowanceListSchema);
  }

  updateAllowance(teamId: string, update: AllowanceUpdate): Promise<AllowanceStatus> {
    return this.api.patch(`/admin/allowances/${teamId}`, update, allowanceStatusSchema);
  }

  async auditEvents(limit = 200): Promise<AuditEventView[]> {
    return (await this.api.get('/admin/audit-events', auditEventListSchema, { limit })).events;
  }

  async mailbox(limit = 100): Promise<MailboxMessage[]> {
    return (await this.api.get('/admin/mailbox', mailboxListSchema, { limit })).messages;
  }

  async workers(): Promise<WorkerPresence[]> {
    return (await this.api.get('/admin/workers', workerListSchema)).workers;
  }
}
