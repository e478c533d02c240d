import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { Collab } from '../drafts/collab-server';
import { versionRoutes } from './versions.routes';
import { lockRoutes } from '../lock/lock.routes';
import { auditRoutes } from '../audit/audit.routes';
import { exportRoutes } from '../exports/exports.routes';

/** Versions, compare and restore, the production lock, the audit trail, exports and import. */
export function registerVersions(r: RouteTable, ctx: AppContext, collab: Collab): void {
  versionRoutes(r, ctx, collab);
  lockRoutes(r, ctx, collab.rooms);
  auditRoutes(r, ctx);
  exportRoutes(r, ctx, collab);
}
