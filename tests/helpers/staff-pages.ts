/**
 * Renders staff pages in-process with Astro's container, as a signed-in member of a firm would get
 * them (real pages, real layout, real PostgreSQL behind `locals.em`), and reads their text.
 */
import { experimental_AstroContainer as AstroContainer } from 'astro/container';
import { getContainerRenderer } from '@astrojs/react';
import { loadRenderers } from 'astro:container';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Company } from '../../src/lib/server/companies/company.entity';
import type { Membership } from '../../src/lib/server/users/membership.entity';
import type { User } from '../../src/lib/server/users/user.entity';

let container: Promise<AstroContainer> | undefined;

function theContainer(): Promise<AstroContainer> {
  container ??= (async () => AstroContainer.create({ renderers: await loadRenderers([getContainerRenderer()]) }))();
  return container;
}

// The pages as modules; each is imported on first use.
export const PAGES = {
  inquiries: () => import('../../src/pages/app/index.astro'),
  lead: () => import('../../src/pages/app/leads/[id].astro'),
  team: () => import('../../src/pages/app/setup/team.astro'),
  setup: () => import('../../src/pages/app/setup/index.astro'),
  setupProfile: () => import('../../src/pages/app/setup/profile.astro'),
  setupServiceArea: () => import('../../src/pages/app/setup/service-area.astro'),
  setupNotifications: () => import('../../src/pages/app/setup/notifications.astro'),
  setupWidget: () => import('../../src/pages/app/setup/widget.astro'),
  setupVisits: () => import('../../src/pages/app/setup/visits.astro'),
  setupLostReasons: () => import('../../src/pages/app/setup/lost-reasons.astro'),
  setupMailTemplates: () => import('../../src/pages/app/setup/mail-templates.astro'),
};

export async function renderStaffPage(
  page: keyof typeof PAGES,
  as: { em: EntityManager; company: Company; user: User; membership: Membership },
  url: string,
  params: Record<string, string> = {},
): Promise<string> {
  const { default: component } = await PAGES[page]();
  const membership = { id: as.membership.id, companyId: as.company.id, companyName: as.company.name, companySlug: as.company.slug, role: as.membership.role };
  const locals = {
    em: as.em,
    user: { id: as.user.id, email: as.user.email, name: as.user.name },
    session: { token: 'rendered-in-a-test', expiresAt: new Date(Date.now() + 3_600_000), absoluteExpiresAt: new Date(Date.now() + 3_600_000) },
    membership,
    memberships: [membership],
  } as unknown as App.Locals;
  return (await theContainer()).renderToString(component, { locals, params, request: new Request(new URL(url, 'http://127.0.0.1:4321')) });
}

/** The page's visible text, tags dropped and spaces collapsed, for sentences a person would read. */
export function textOf(html: string): string {
  return html
    .replace(/<(script|style)[\s\S]*?<\/\1>/g, ' ')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ')
    .trim();
}
