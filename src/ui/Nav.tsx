import type { ComponentChildren } from 'preact';
import { routeHref, type ScreenName } from './router';

interface NavItem {
  screen: ScreenName;
  label: string;
  icon: ComponentChildren;
}

// Line glyphs of our own, drawn on a 24 unit grid.
const ITEMS: NavItem[] = [
  {
    screen: 'day',
    label: 'Test day',
    icon: <path d="M4 6h16v14H4zM4 10h16M8 3v5M16 3v5M8 14h3v3H8z" />,
  },
  {
    screen: 'plan',
    label: 'Planner',
    icon: <path d="M12 3v10M8 13h8l-4 6zM5 21h14" />,
  },
  {
    screen: 'specimens',
    label: 'Specimens',
    icon: <path d="M12 4a5 5 0 1 1 0 10a5 5 0 1 1 0-10zM5 20h14M9 17h6" />,
  },
  {
    screen: 'log',
    label: 'Log',
    icon: <path d="M6 3h12v18H6zM9 8h6M9 12h6M9 16h4" />,
  },
  {
    screen: 'send',
    label: 'Send',
    icon: <path d="M12 16V4M7 9l5-5 5 5M5 14v6h14v-6" />,
  },
];

export function Nav({ current, unsent }: { current: ScreenName; unsent: number }) {
  return (
    <nav class="tabbar" aria-label="Main">
      {ITEMS.map((item) => (
        <a
          key={item.screen}
          href={routeHref(item.screen)}
          class={`tab ${current === item.screen ? 'tab-on' : ''}`}
          aria-current={current === item.screen ? 'page' : undefined}
        >
          <svg viewBox="0 0 24 24" width="26" height="26" aria-hidden="true" class="tab-icon">
            {item.icon}
          </svg>
          <span class="tab-label">{item.label}</span>
          {item.screen === 'send' && unsent > 0 ? (
            <span class="tab-badge" aria-label={`${unsent} unsent changes`}>
              {unsent > 999 ? '999+' : unsent}
            </span>
          ) : null}
        </a>
      ))}
    </nav>
  );
}
