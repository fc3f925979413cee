import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { roles } from '../../../shared/schemas/session.js';
import { Team } from './team.js';

const p = defineEntity.properties;

/** A person who signs in. E-mails are stored lower-case; the password hash never leaves the server. */
export const User = defineEntity({
  name: 'User',
  tableName: 'app_user',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    email: p.string().length(254).unique(),
    name: p.string().length(120),
    passwordHash: p.string().length(255).hidden(),
    role: p.enum([...roles]),
    team: p.manyToOne(Team),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type User = InferEntity<typeof User>;
