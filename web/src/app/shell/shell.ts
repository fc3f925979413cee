import { ChangeDetectionStrategy, Component, type ElementRef, computed, inject, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar, MatSnackBarModule } from '@angular/material/snack-bar';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { toApiFailure } from '../core/api-failure';
import { Session } from '../core/session';
import { BrandMark } from '../shared/brand-mark';
import { roleLabel } from './role-label';

/** The frame around every signed-in screen: product name, navigation, who is signed in, sign-out. */
@Component({
  selector: 'app-shell',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatButtonModule,
    MatIconModule,
    MatSnackBarModule,
    MatToolbarModule,
    BrandMark,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly main = viewChild.required<ElementRef<HTMLElement>>('main');

  protected readonly user = this.session.user;
  protected readonly isAdmin = this.session.isAdmin;
  protected readonly role = computed(() => {
    const user = this.user();
    return user ? roleLabel(user.role) : '';
  });
  protected readonly initials = computed(() => initialsOf(this.user()?.name ?? ''));

  protected skipToContent(): void {
    this.main().nativeElement.focus();
  }

  protected async signOut(): Promise<void> {
    try {
      await this.session.signOut();
    } catch (err) {
      this.snackBar.open(`Signed out here, but the server was not told: ${toApiFailure(err).message}`, 'Close', {
        duration: 8000,
      });
    }
    await this.router.navigate(['/sign-in']);
  }
}

function initialsOf(name: string): string {
  const words = name.trim().split(/\s+/).filter(Boolean);
  const letters = words.length > 1 ? [words[0], words[words.length - 1]] : words;
  return letters.map((word) => word[0]?.toUpperCase() ?? '').join('');
}
