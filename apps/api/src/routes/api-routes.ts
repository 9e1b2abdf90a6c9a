import { authRoutes } from '../modules/auth/auth-router.ts';
import { healthRoutes } from '../modules/health/health-router.ts';
import { invitationRoutes } from '../modules/invitations/invitation-router.ts';
import { customerRoutes } from '../modules/jobs/customer-router.ts';
import { jobRoutes } from '../modules/jobs/job-router.ts';
import { jobReportRoutes } from '../modules/jobs/job-report-router.ts';
import { jobSheetRoutes } from '../modules/jobs/job-sheet-router.ts';
import { visitRoutes } from '../modules/jobs/visit-router.ts';
import { itemKindRoutes } from '../modules/item-kinds/item-kind-router.ts';
import { kitItemRoutes } from '../modules/kits/kit-item-router.ts';
import { kitRoutes } from '../modules/kits/kit-router.ts';
import { locationRoutes } from '../modules/locations/location-router.ts';
import { memberRoutes } from '../modules/members/member-router.ts';
import { openApiRoute } from '../modules/openapi/openapi-router.ts';
import { outboxRoutes } from '../modules/outbox/outbox-router.ts';
import { photoRoutes } from '../modules/photos/photo-router.ts';
import { productRoutes } from '../modules/stock/product-router.ts';
import { restockRoutes } from '../modules/stock/restock-router.ts';
import { stockMovementRoutes } from '../modules/stock/stock-movement-router.ts';
import { stockRoutes } from '../modules/stock/stock-router.ts';
import { reminderRoutes } from '../modules/reminders/reminder-router.ts';
import { unsubscribeRoutes } from '../modules/reminders/unsubscribe-router.ts';
import { firmRoutes } from '../modules/firms/firm-router.ts';
import { overviewRoutes } from '../modules/overview/overview-router.ts';
import { siteRoutes } from '../modules/sites/site-router.ts';
import { vibrationRoutes } from '../modules/vibration/vibration-router.ts';
import { paymentRoutes } from '../modules/payments/payment-router.ts';
import { billingRoutes } from '../modules/billing/billing-router.ts';
import { invoiceRoutes } from '../modules/money/invoice-router.ts';
import { quoteRoutes } from '../modules/money/quote-router.ts';
import { moneyReportRoutes } from '../modules/money/money-report-router.ts';
import type { RouteDefinition } from './route-registry.ts';

/**
 * Every API route, in one list: the app mounts these, the OpenAPI document describes them, and
 * the tenant-isolation and role-matrix tests call each one. A new module adds its list here.
 */
export const apiRoutes: RouteDefinition[] = [
  ...healthRoutes,
  ...authRoutes,
  ...memberRoutes,
  ...invitationRoutes,
  ...locationRoutes,
  ...itemKindRoutes,
  ...kitRoutes,
  ...kitItemRoutes,
  ...photoRoutes,
  ...productRoutes,
  ...stockRoutes,
  ...stockMovementRoutes,
  ...restockRoutes,
  ...customerRoutes,
  ...jobRoutes,
  ...jobReportRoutes,
  ...jobSheetRoutes,
  ...visitRoutes,
  ...reminderRoutes,
  ...unsubscribeRoutes,
  ...firmRoutes,
  ...overviewRoutes,
  ...siteRoutes,
  ...vibrationRoutes,
  ...outboxRoutes,
  ...paymentRoutes,
  ...billingRoutes,
  ...invoiceRoutes,
  ...quoteRoutes,
  ...moneyReportRoutes,
  openApiRoute(() => apiRoutes),
];
