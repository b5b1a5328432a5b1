import type { RequestHandler } from 'express';
import type { Role } from '@shared/schemas/auth';
import { parseIdText } from '@shared/schemas/common';
import { AppError } from '../errors';
import type { Db } from '../db/knex';
import { clubAndRolesVia, clubVia, rolesInClub, type ClubLookup } from '../services/memberships';

/** Refuses requests from people who are not signed in. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.session.userId) return next(new AppError('unauthenticated', 'Please sign in.'));
  next();
};

/**
 * Lets the request through only when the signed-in person holds one of the roles in the
 * club named by the :clubId route parameter; the roles found are left on req.clubRoles.
 */
export function requireClubRole(db: Db, ...allowed: Role[]): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session.userId;
    if (!userId) return next(new AppError('unauthenticated', 'Please sign in.'));
    const clubId = parseIdText(req.params.clubId);
    if (clubId === null) {
      return next(new AppError('validation_failed', 'Invalid club.', { clubId: 'Must be a whole number from 1 to 2147483647' }));
    }
    const roles = req.memberships ? (req.memberships[clubId] ?? []) : await rolesInClub(db, clubId, userId);
    if (roles.length === 0) return next(new AppError('forbidden', 'You are not a member of this club.'));
    if (allowed.length > 0 && !roles.some((r) => allowed.includes(r))) {
      return next(new AppError('forbidden', 'Your role in this club does not allow that.'));
    }
    req.clubId = clubId;
    req.clubRoles = roles;
    next();
  };
}

/**
 * Like requireClubRole for routes keyed by another record (/api/sites/:siteId, /api/plots/:plotId):
 * lookup finds the record's club (in the same query as the roles); a record that is missing, or in a club the person is not
 * part of, answers 404 so ids of other clubs reveal nothing.
 */
export function requireRoleVia(
  db: Db,
  param: string,
  lookup: ClubLookup,
  what: string,
  ...allowed: Role[]
): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session.userId;
    if (!userId) return next(new AppError('unauthenticated', 'Please sign in.'));
    const id = parseIdText(req.params[param]);
    if (id === null) {
      return next(
        new AppError('validation_failed', `Invalid ${what.toLowerCase()} id.`, { [param]: 'Must be a whole number from 1 to 2147483647' }),
      );
    }
    const found = req.memberships ? await clubVia(db, lookup, id, req.memberships) : await clubAndRolesVia(db, lookup, id, userId);
    if (!found || found.roles.length === 0) return next(new AppError('not_found', `${what} was not found.`));
    const { clubId, roles, row } = found;
    if (allowed.length > 0 && !roles.some((r) => allowed.includes(r))) {
      return next(new AppError('forbidden', 'Your role in this club does not allow that.'));
    }
    req.clubId = clubId;
    req.clubRoles = roles;
    req.via = row;
    next();
  };
}
