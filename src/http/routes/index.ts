/**
 * Every route plugin, registered in this order by app.ts. A new route adds
 * its plugin here and its entry (with schema ids) in ../route-table.ts.
 */
import type { FastifyPluginAsync } from 'fastify';
import { analysisRoutes } from './analyses.js';
import { checkRoutes } from './checks.js';
import { comparisonRoutes } from './comparisons.js';
import { criteriaRoutes } from './criteria.js';
import { healthRoutes } from './health.js';
import { openApiRoutes } from './openapi.js';
import { pageRoutes } from './page.js';
import { plotRoutes } from './plots.js';
import { reportRoutes } from './reports.js';
import { estimateRoutes } from './estimates.js';

export const ROUTE_PLUGINS: FastifyPluginAsync[] = [
  healthRoutes,
  openApiRoutes,
  analysisRoutes,
  checkRoutes,
  comparisonRoutes,
  criteriaRoutes,
  estimateRoutes,
  plotRoutes,
  reportRoutes,
  pageRoutes,
];
