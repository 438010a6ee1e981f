/**
 * The price widget's loader, served as ORIGIN/widget.js. A firm pastes
 *   <script src="ORIGIN/widget.js" data-company="SLUG" async></script>
 * and this puts the widget in an iframe of ORIGIN/embed/SLUG, either inline where the script
 * stands (default) or behind a floating button (data-mode="floating"). It loads nothing until the
 * widget is near the screen or the button is pressed, and never blocks the host page.
 */
/**
 * White or ink text on the button's colour, whichever contrasts more. The loader is one script with
 * no imports, so this repeats `textOn` in src/lib/shared/contrast.ts.
 * Source: W3C, WCAG 2.2, definitions "relative luminance" and "contrast ratio"; docs/sources.md §17.
 */
function textOnColour(hex: string): string {
  const linear = (i: number) => {
    const c = parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  const luminance = 0.2126 * linear(0) + 0.7152 * linear(1) + 0.0722 * linear(2);
  const inkLuminance = 0.0214; // #1F2A2E by the same formula
  return 1.05 / (luminance + 0.05) >= (luminance + 0.05) / (inkLuminance + 0.05) ? '#FFFFFF' : '#1F2A2E';
}

(() => {
  const script =
    (document.currentScript as HTMLScriptElement | null) ??
    Array.from(document.querySelectorAll<HTMLScriptElement>('script[data-company]')).find((s) => !s.dataset.lapwingDone) ??
    null;
  if (!script || script.dataset.lapwingDone) return;
  script.dataset.lapwingDone = '1';
  const slug = script.dataset.company ?? '';
  if (!/^[a-z0-9][a-z0-9-]*$/.test(slug)) return;
  const origin = new URL(script.src).origin;
  const src = `${origin}/embed/${slug}?host=${encodeURIComponent(location.origin)}`;
  const floating = script.dataset.mode === 'floating';
  const label = script.dataset.label || 'Price your walls';
  const colour = /^#[0-9a-fA-F]{6}$/.test(script.dataset.color ?? '') ? script.dataset.color! : '#2F6B4F';

  function makeFrame(): HTMLIFrameElement {
    const frame = document.createElement('iframe');
    frame.src = src;
    frame.title = label;
    frame.setAttribute('allow', 'camera');
    frame.style.cssText = 'width:100%;border:0;display:block;color-scheme:light;';
    frame.style.height = floating ? '100%' : '640px';
    // Only our own iframe, from our own origin, may set the height or move the page.
    window.addEventListener('message', (event) => {
      if (event.origin !== origin || event.source !== frame.contentWindow || floating) return;
      const data = event.data as { type?: string; height?: number } | null;
      if (data?.type === 'lapwing:height' && typeof data.height === 'number' && Number.isFinite(data.height)) {
        // The frame grows and shrinks with its content; its top stays where it was on screen, so
        // the host page's own content does not jump when a step gets shorter.
        const topBefore = frame.getBoundingClientRect().top;
        frame.style.height = `${Math.round(Math.min(Math.max(data.height, 240), 8000))}px`;
        const moved = frame.getBoundingClientRect().top - topBefore;
        if (Math.abs(moved) >= 1) window.scrollBy(0, moved);
      } else if (data?.type === 'lapwing:step') {
        // A new step starts at its top: bring the frame's top into view, only if it is out of view.
        const top = frame.getBoundingClientRect().top;
        if (top < 0 || top > window.innerHeight - 80) frame.scrollIntoView({ block: 'start' });
      }
    });
    return frame;
  }

  if (!floating) {
    const holder = document.createElement('div');
    holder.className = 'lapwing-widget';
    holder.style.minHeight = '640px';
    script.after(holder);
    const load = () => {
      holder.appendChild(makeFrame());
      holder.style.minHeight = '';
    };
    if ('IntersectionObserver' in window) {
      const watcher = new IntersectionObserver(
        (entries) => {
          if (entries.some((e) => e.isIntersecting)) {
            watcher.disconnect();
            load();
          }
        },
        { rootMargin: '600px' },
      );
      watcher.observe(holder);
    } else load();
    return;
  }

  const button = document.createElement('button');
  button.type = 'button';
  button.textContent = label;
  button.setAttribute('aria-expanded', 'false');
  button.style.cssText = `position:fixed;right:16px;bottom:16px;z-index:2147483000;padding:12px 18px;border:0;border-radius:999px;background:${colour};color:${textOnColour(colour)};font:600 16px/1.2 system-ui,sans-serif;box-shadow:0 2px 10px rgba(0,0,0,.25);cursor:pointer;`;
  let panel: HTMLDivElement | null = null;
  const close = () => {
    if (panel) panel.style.display = 'none';
    button.setAttribute('aria-expanded', 'false');
    button.focus();
  };
  button.addEventListener('click', () => {
    if (!panel) {
      panel = document.createElement('div');
      panel.setAttribute('role', 'dialog');
      panel.setAttribute('aria-label', label);
      panel.style.cssText =
        'position:fixed;right:16px;bottom:76px;z-index:2147483001;width:min(440px,calc(100vw - 32px));height:min(760px,calc(100vh - 96px));background:#FAF7F2;border-radius:12px;box-shadow:0 4px 24px rgba(0,0,0,.3);overflow:hidden;display:flex;flex-direction:column;';
      const shut = document.createElement('button');
      shut.type = 'button';
      shut.textContent = 'Close';
      shut.style.cssText =
        'align-self:flex-end;margin:6px;padding:6px 12px;border:1px solid #5B6B73;border-radius:6px;background:#fff;color:#1F2A2E;font:500 14px system-ui,sans-serif;cursor:pointer;';
      shut.addEventListener('click', close);
      panel.addEventListener('keydown', (event) => {
        if (event.key === 'Escape') close();
      });
      const frame = makeFrame();
      frame.style.flex = '1';
      panel.append(shut, frame);
      document.body.appendChild(panel);
    } else panel.style.display = 'flex';
    button.setAttribute('aria-expanded', 'true');
  });
  void (document.body ? Promise.resolve() : new Promise((r) => addEventListener('DOMContentLoaded', r))).then(() => document.body.appendChild(button));
})();
