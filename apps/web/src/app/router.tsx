import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { session } from '@/api/session';
import { RequirePermission } from '@/features/auth/components/RequirePermission';
import { RequireSession } from '@/features/auth/components/RequireSession';
import {
  mailboxListQuery,
  mailboxMessageQuery,
  DEFAULT_MAILBOX_PAGE,
} from '@/features/mailbox/api/mailbox.queries';
import { organisationQuery } from '@/features/organisation/api/organisation.queries';
import { contractPresetsQuery, contractsQuery, skillsQuery } from '@/features/planning/api/planning.queries';
import { periodReportQuery } from '@/features/reports/api/reports.queries';
import { unitsQuery } from '@/features/units/api/units.queries';
import { usersListQuery } from '@/features/users/api/users.queries';
import { readUsersListParams } from '@/features/users/usersListParams';
import { AppShell } from '@/features/navigation/components/AppShell';
import { ErrorPage } from '@/pages/ErrorPage';
import { LoadingState } from '@/ui/LoadingState';
import { PATHS, ROUTE_PATTERNS } from './paths';

/** Turns `() => import('./XPage')` into a lazy route whose chunk loads on first visit. */
function page<K extends string>(load: () => Promise<Record<K, ComponentType>>, name: K): RouteObject['lazy'] {
  return async () => ({ Component: (await load())[name] });
}

/** Starts fetching a page's data alongside its code, when someone is signed in to receive it. */
function prefetch(run: () => Promise<unknown>): () => null {
  return () => {
    if (session.getState().status === 'signedIn') void run().catch(() => undefined);
    return null;
  };
}

export function createRouter(queryClient: QueryClient) {
  const routes: RouteObject[] = [
    {
      errorElement: <ErrorPage />,
      hydrateFallbackElement: <LoadingState fullPage label="Opening Rotaplex…" />,
      children: [
        { path: PATHS.signIn, lazy: page(() => import('@/pages/SignInPage'), 'SignInPage') },
        {
          path: PATHS.acceptInvitation,
          lazy: page(() => import('@/pages/AcceptInvitationPage'), 'AcceptInvitationPage'),
        },
        {
          path: PATHS.forgotPassword,
          lazy: page(() => import('@/pages/ForgotPasswordPage'), 'ForgotPasswordPage'),
        },
        {
          path: PATHS.resetPassword,
          lazy: page(() => import('@/pages/ResetPasswordPage'), 'ResetPasswordPage'),
        },
        {
          path: PATHS.swapDecision,
          lazy: page(() => import('@/pages/SwapDecisionPage'), 'SwapDecisionPage'),
        },
        {
          element: <RequireSession />,
          children: [
            {
              element: <AppShell />,
              children: [
                {
                  errorElement: <ErrorPage />,
                  children: [
                    {
                      index: true,
                      loader: prefetch(() => queryClient.prefetchQuery(unitsQuery())),
                      lazy: page(() => import('@/pages/HomePage'), 'HomePage'),
                    },
                    { path: PATHS.profile, lazy: page(() => import('@/pages/ProfilePage'), 'ProfilePage') },
                    {
                      element: <RequirePermission permission="rosters:read" />,
                      children: [
                        {
                          path: PATHS.myRoster,
                          lazy: page(() => import('@/pages/MyRosterPage'), 'MyRosterPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="users:read" />,
                      children: [
                        {
                          path: PATHS.users,
                          loader: ({ request }) =>
                            prefetch(() =>
                              Promise.all([
                                queryClient.prefetchQuery(
                                  usersListQuery(readUsersListParams(new URL(request.url).searchParams)),
                                ),
                                queryClient.prefetchQuery(unitsQuery()),
                              ]),
                            )(),
                          lazy: page(() => import('@/pages/UsersPage'), 'UsersPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="units:write" />,
                      children: [
                        {
                          path: PATHS.units,
                          loader: prefetch(() => queryClient.prefetchQuery(unitsQuery())),
                          lazy: page(() => import('@/pages/UnitsPage'), 'UnitsPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="organisation:manage" />,
                      children: [
                        {
                          path: PATHS.organisation,
                          loader: prefetch(() => queryClient.prefetchQuery(organisationQuery())),
                          lazy: page(() => import('@/pages/OrganisationPage'), 'OrganisationPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="rosters:plan" />,
                      children: [
                        {
                          path: PATHS.rosterPeriods,
                          loader: prefetch(() => queryClient.prefetchQuery(unitsQuery())),
                          lazy: page(() => import('@/pages/RosterPeriodsPage'), 'RosterPeriodsPage'),
                        },
                        {
                          path: ROUTE_PATTERNS.planningBoard,
                          lazy: page(() => import('@/pages/PlanningBoardPage'), 'PlanningBoardPage'),
                        },
                        {
                          path: ROUTE_PATTERNS.periodAudit,
                          lazy: page(() => import('@/pages/AuditPage'), 'AuditPage'),
                        },
                        {
                          path: PATHS.coverNeeds,
                          loader: prefetch(() =>
                            Promise.all([
                              queryClient.prefetchQuery(unitsQuery()),
                              queryClient.prefetchQuery(skillsQuery()),
                            ]),
                          ),
                          lazy: page(() => import('@/pages/CoverNeedsPage'), 'CoverNeedsPage'),
                        },
                        {
                          path: PATHS.demand,
                          loader: prefetch(() => queryClient.prefetchQuery(unitsQuery())),
                          lazy: page(() => import('@/pages/DemandPage'), 'DemandPage'),
                        },
                        {
                          path: ROUTE_PATTERNS.demandPlan,
                          lazy: page(() => import('@/pages/DemandPlanPage'), 'DemandPlanPage'),
                        },
                        {
                          path: PATHS.staff,
                          loader: prefetch(() =>
                            Promise.all([
                              queryClient.prefetchQuery(unitsQuery()),
                              queryClient.prefetchQuery(skillsQuery()),
                              queryClient.prefetchQuery(contractsQuery()),
                            ]),
                          ),
                          lazy: page(() => import('@/pages/StaffPage'), 'StaffPage'),
                        },
                        {
                          path: PATHS.shiftTypes,
                          loader: prefetch(() => queryClient.prefetchQuery(unitsQuery())),
                          lazy: page(() => import('@/pages/ShiftTypesPage'), 'ShiftTypesPage'),
                        },
                        {
                          path: PATHS.contracts,
                          loader: prefetch(() =>
                            Promise.all([
                              queryClient.prefetchQuery(contractsQuery()),
                              queryClient.prefetchQuery(contractPresetsQuery()),
                              queryClient.prefetchQuery(unitsQuery()),
                            ]),
                          ),
                          lazy: page(() => import('@/pages/ContractsPage'), 'ContractsPage'),
                        },
                        {
                          path: PATHS.skills,
                          loader: prefetch(() => queryClient.prefetchQuery(skillsQuery())),
                          lazy: page(() => import('@/pages/SkillsPage'), 'SkillsPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="requests:own" />,
                      children: [
                        { path: PATHS.swaps, lazy: page(() => import('@/pages/SwapsPage'), 'SwapsPage') },
                        {
                          path: PATHS.myAvailability,
                          lazy: page(() => import('@/pages/MyAvailabilityPage'), 'MyAvailabilityPage'),
                        },
                        {
                          path: PATHS.myRequests,
                          lazy: page(() => import('@/pages/MyRequestsPage'), 'MyRequestsPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="requests:approve" />,
                      children: [
                        {
                          path: PATHS.swapApprovals,
                          lazy: page(() => import('@/pages/SwapsPage'), 'SwapApprovalsPage'),
                        },
                        {
                          path: PATHS.requests,
                          lazy: page(() => import('@/pages/RequestsPage'), 'RequestsPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="rosters:read" />,
                      children: [
                        {
                          path: PATHS.openShifts,
                          lazy: page(() => import('@/pages/OpenShiftsPage'), 'OpenShiftsPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="reports:read" />,
                      children: [
                        {
                          path: ROUTE_PATTERNS.periodReports,
                          loader: ({ params }) =>
                            prefetch(() =>
                              queryClient.prefetchQuery(periodReportQuery(params.periodId ?? '')),
                            )(),
                          lazy: page(() => import('@/pages/ReportsPage'), 'ReportsPage'),
                        },
                      ],
                    },
                    {
                      element: <RequirePermission permission="mailbox:read" />,
                      children: [
                        {
                          path: PATHS.mailbox,
                          loader: prefetch(() =>
                            queryClient.prefetchQuery(mailboxListQuery(DEFAULT_MAILBOX_PAGE)),
                          ),
                          lazy: page(() => import('@/pages/MailboxPage'), 'MailboxPage'),
                        },
                        {
                          path: ROUTE_PATTERNS.mailboxMessage,
                          loader: ({ params }) =>
                            prefetch(() =>
                              queryClient.prefetchQuery(mailboxMessageQuery(params.messageId ?? '')),
                            )(),
                          lazy: page(() => import('@/pages/MailMessagePage'), 'MailMessagePage'),
                        },
                        { path: PATHS.outbox, lazy: page(() => import('@/pages/OutboxPage'), 'OutboxPage') },
                      ],
                    },
                    { path: '*', lazy: page(() => import('@/pages/NotFoundPage'), 'NotFoundPage') },
                  ],
                },
              ],
            },
          ],
        },
      ],
    },
  ];
  return createBrowserRouter(routes);
}
