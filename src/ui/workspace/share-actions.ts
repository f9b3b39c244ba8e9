/**
 * Share links: the open plan carried in the URL fragment (src/io/share-link.ts), which never
 * reaches a server. A link opens on the planner with the plan it carries: at once when the visitor
 * has no work of their own open, else after a yes, keeping the open plan first (keep-plan.ts); a
 * damaged, foreign or too large link says why and changes nothing.
 */
import type { PlanFile } from '../../io/plan-file';
import { decodeShareFragment, encodeShareFragment } from '../../io/share-link';
import { describePlanMessage } from '../planner/plan-paths';
import { useSekundoStore } from '../store';
import { openPlanIsOwnWork, replaceOpenPlan } from './keep-plan';
import { useWorkspaceStore } from './workspace-store';

/** The page's address with the plan in its fragment. */
export function shareUrl(plan: PlanFile, location: Pick<Location, 'origin' | 'pathname' | 'search'> = window.location): string {
  return `${location.origin}${location.pathname}${location.search}${encodeShareFragment(plan)}`;
}

/** Takes the link out of the address bar, so a reload does not ask again. */
function clearFragment(): void {
  if (typeof window === 'undefined' || !window.location.hash) return;
  try {
    window.history.replaceState(window.history.state, '', `${window.location.pathname}${window.location.search}`);
  } catch {
    // An address that cannot be rewritten costs only the tidy address bar.
  }
}

/**
 * Reads a URL fragment: a plan opens on the planner — at once when nothing of the visitor's own
 * would be replaced, else after their yes; a broken link is reported; anything else (no fragment,
 * another page's fragment) is left alone. A broken link never changes the open plan.
 */
export function readShareFragment(hash: string): void {
  const decoded = decodeShareFragment(hash);
  if (decoded.ok === 'none') return;
  clearFragment();
  if (!decoded.ok) {
    useWorkspaceStore.setState({ linkProblem: decoded.errors.map(describePlanMessage), sharePrompt: null });
    return;
  }
  useSekundoStore.getState().setActiveView('planner');
  useWorkspaceStore.setState({ sharePrompt: { plan: decoded.plan }, linkProblem: null });
  if (!openPlanIsOwnWork()) acceptSharedPlan();
}

/** Yes: the open plan is kept (a named copy in Saved plans), the shared plan replaces it, and the planner shows it. */
export function acceptSharedPlan(): void {
  const prompt = useWorkspaceStore.getState().sharePrompt;
  if (!prompt) return;
  useWorkspaceStore.setState({ sharePrompt: null });
  replaceOpenPlan(prompt.plan, { kind: 'link', note: null }, 'opening a shared link', () => {
    useSekundoStore.getState().setActiveView('planner');
    useWorkspaceStore.setState({ currentSavedId: null, currentSavedAt: null });
  });
}

/** No: the open plan stays. */
export function declineSharedPlan(): void {
  useWorkspaceStore.setState({ sharePrompt: null });
}
