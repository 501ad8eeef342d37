import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router';
import type { Role } from '../../shared/schemas/auth';
import { useSessionStore } from '@/stores/session';

declare module 'vue-router' {
  interface RouteMeta {
    /** Signed-in users only. */
    requiresAuth?: boolean;
    /** Only this role (implies requiresAuth). */
    role?: Role;
    /** Pages for signed-out users (sign in, register): a signed-in user goes home. */
    guestOnly?: boolean;
    title?: string;
  }
}

const routes: RouteRecordRaw[] = [
  // The planner is the home page after sign-in; `?sightline=<id>` opens a saved sightline in it.
  { path: '/', name: 'home', component: () => import('@/views/PlannerView.vue'), meta: { requiresAuth: true, title: 'Planner' } },
  { path: '/sightlines', name: 'sightlines', component: () => import('@/views/SightlinesView.vue'), meta: { requiresAuth: true, title: 'Sightlines' } },
  // One sightline: lineup search and results, night chart, year view, field notes and tides.
  { path: '/sightlines/:id', name: 'sightline', component: () => import('@/views/SightlineView.vue'), meta: { requiresAuth: true, title: 'Sightline' } },
  // Watches: e-mails before coming lineups, and the secret calendar feed.
  // An outing on a lineup night: the sightline page's state, shown for one night, readable on a phone.
  { path: '/sightlines/:id/outings/:outingId', name: 'outing', component: () => import('@/views/OutingView.vue'), meta: { requiresAuth: true, title: 'Outing' } },
  // An invite link from an e-mail: works signed out (to register or sign in with the invited address).
  { path: '/invites/accept', name: 'invite-accept', component: () => import('@/views/InviteAcceptView.vue'), meta: { title: 'Crew invite' } },
  { path: '/gear', name: 'gear', component: () => import('@/views/GearView.vue'), meta: { requiresAuth: true, title: 'Gear' } },
  { path: '/watches', name: 'watches', component: () => import('@/views/WatchesView.vue'), meta: { requiresAuth: true, title: 'Watches' } },
  // The pause link of a watch's e-mail: works signed in or out (neither requiresAuth nor guestOnly).
  { path: '/watches/unsubscribe', name: 'watch-unsubscribe', component: () => import('@/views/WatchUnsubscribeView.vue'), meta: { title: 'Pause a watch' } },
  { path: '/signin', name: 'signin', component: () => import('@/views/SignInView.vue'), meta: { guestOnly: true, title: 'Sign in' } },
  { path: '/register', name: 'register', component: () => import('@/views/RegisterView.vue'), meta: { guestOnly: true, title: 'Create account' } },
  { path: '/admin', name: 'admin', component: () => import('@/views/AdminView.vue'), meta: { requiresAuth: true, role: 'admin', title: 'Accounts' } },
  // What the local mail catcher received (the embedded start sends no mail anywhere else).
  { path: '/admin/outbox', name: 'outbox', component: () => import('@/views/OutboxView.vue'), meta: { requiresAuth: true, role: 'admin', title: 'Outbox' } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { title: 'Not found' } },
];

export const router = createRouter({ history: createWebHistory(), routes });

router.beforeEach(async (to) => {
  const session = useSessionStore();
  await session.load().catch(() => undefined);
  if ((to.meta.requiresAuth || to.meta.role) && !session.isSignedIn) {
    return { name: 'signin', query: to.fullPath !== '/' ? { next: to.fullPath } : {} };
  }
  if (to.meta.role && session.user?.role !== to.meta.role) return { name: 'home' };
  if (to.meta.guestOnly && session.isSignedIn) return { name: 'home' };
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Gnomon` : 'Gnomon';
});
