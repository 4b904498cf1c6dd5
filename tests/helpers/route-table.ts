// The API's route table read off the running Express app: every method and path, the actions its
// guards demand (requireAction marks its handler with the action) and whether it sits behind the
// campaign membership check. Guards mounted with router.use apply to the layers after them whose
// path they match, as Express runs them.
import type { Express } from "express";
import type { Action } from "../../shared/permissions";

export interface RouteEntry {
  readonly method: string;
  readonly path: string;
  readonly actions: readonly Action[];
  readonly campaignScoped: boolean;
}

interface Handle {
  (...args: unknown[]): unknown;
  action?: Action;
  campaignScope?: boolean;
  stack?: Layer[];
}

interface Layer {
  rawPath?: string | string[];
  handle: Handle;
  route?: { path: string; methods: Record<string, boolean>; stack: Layer[] };
}

interface Guard {
  /** The path the guard was mounted on, relative to its router ("" for every path). */
  readonly under: string;
  readonly action?: Action;
  readonly campaignScope?: boolean;
}

const mountPath = (layer: Layer): string => {
  const raw = Array.isArray(layer.rawPath) ? layer.rawPath[0] : layer.rawPath;
  return raw === undefined || raw === "/" ? "" : raw;
};

// Whole segments only: "/:campaignId" covers "/:campaignId/sites", not "/:campaignIdx".
const covers = (under: string, path: string) =>
  under === "" || path === under || path.startsWith(`${under}/`);

function walk(stack: Layer[], prefix: string, inherited: Guard[], out: RouteEntry[]): void {
  const guards: Guard[] = [];
  for (const layer of stack) {
    const here = layer.route ? layer.route.path : mountPath(layer);
    const applying = [...inherited, ...guards.filter((g) => covers(g.under, here))];
    if (layer.route) {
      const own = layer.route.stack.map((l) => l.handle);
      const actions = [...applying.map((g) => g.action), ...own.map((h) => h.action)];
      const scoped = [...applying, ...own].some((g) => g.campaignScope === true);
      for (const method of Object.keys(layer.route.methods).filter((m) => m !== "_all"))
        out.push({
          method: method.toUpperCase(),
          path: prefix + layer.route.path,
          actions: actions.filter((a): a is Action => a !== undefined),
          campaignScoped: scoped,
        });
    } else if (layer.handle.stack) {
      walk(layer.handle.stack, prefix + here, applying, out);
    } else if (layer.handle.action !== undefined || layer.handle.campaignScope === true) {
      guards.push({
        under: here,
        action: layer.handle.action,
        campaignScope: layer.handle.campaignScope,
      });
    }
  }
}

export function routeTable(app: Express): RouteEntry[] {
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  const out: RouteEntry[] = [];
  walk(router.stack, "", [], out);
  return out;
}
