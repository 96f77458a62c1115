import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, viewChild, ElementRef } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatListItem, MatListItemIcon, MatListItemTitle, MatNavList } from '@angular/material/list';
import { MatDivider } from '@angular/material/divider';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatToolbar } from '@angular/material/toolbar';
import { MatTooltip } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { AuthSession } from '../auth/auth-session';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { RoleLabelPipe } from '../workspace/role-label-pipe';
import { navEntriesFor, roleMayOpen, type SectionId } from './navigation';
import { ThemePreference } from './theme-preference';

/** The frame around every signed-in page: top bar, role-dependent side navigation, main content. */
@Component({
  selector: 'ecl-shell-layout',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatToolbar,
    MatIcon,
    MatIconButton,
    MatTooltip,
    MatSidenavContainer,
    MatSidenav,
    MatSidenavContent,
    MatNavList,
    MatListItem,
    MatListItemIcon,
    MatListItemTitle,
    MatDivider,
    MatMenu,
    MatMenuItem,
    MatMenuTrigger,
    MatFormField,
    MatLabel,
    MatSelect,
    MatSelectTrigger,
    MatOption,
    RoleLabelPipe,
  ],
  templateUrl: './shell-layout.html',
  styleUrl: './shell-layout.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShellLayout {
  private readonly router = inject(Router);
  protected readonly session = inject(AuthSession);
  protected readonly workspace = inject(CurrentWorkspace);
  protected readonly theme = inject(ThemePreference);

  private readonly main = viewChild.required<ElementRef<HTMLElement>>('main');
  private readonly sidenav = viewChild.required(MatSidenav);

  /** Below this width the navigation slides over the content behind a menu button. */
  protected readonly narrow = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 959.98px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );

  protected readonly entries = computed(() => navEntriesFor(this.workspace.membership(), this.session.user()?.isAdmin ?? false));
  /** The workspace's sections, then the others (account, administration), a divider between. */
  protected readonly navGroups = computed(() => [this.entries().filter((e) => e.link[0] === '/w'), this.entries().filter((e) => e.link[0] !== '/w')]);

  protected skipToContent(event: Event): void {
    // A plain #fragment would resolve against <base href> and leave the page; move focus instead.
    event.preventDefault();
    this.main().nativeElement.focus();
  }

  protected closeIfNarrow(): void {
    if (this.narrow()) void this.sidenav().close();
  }

  /** Stays on the same section in the other workspace when the role there opens it. */
  protected switchWorkspace(workspaceId: string): void {
    const target = this.session.workspaces().find((w) => w.workspaceId === workspaceId);
    if (!target) return;
    this.workspace.select(workspaceId);
    const section = /^\/w\/[^/]+\/([a-z-]+)/.exec(this.router.url)?.[1] as SectionId | undefined;
    const keep = section !== undefined && roleMayOpen(target.role, section);
    void this.router.navigate(['/w', workspaceId, keep ? section : 'overview']);
  }

  protected signOut(): void {
    this.session.signOut().subscribe({
      complete: () => void this.router.navigate(['/sign-in']),
      error: () => void this.router.navigate(['/sign-in']),
    });
  }
}
