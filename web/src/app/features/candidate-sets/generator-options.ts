import { ChangeDetectionStrategy, Component, effect, inject, input, output } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import type { GeneratorSettings } from '../../../../../shared/schemas/sweep-description';

/** The generator's options with its defaults (shared/math/term-generator.ts). */
export type GeneratorChoice = Required<Omit<GeneratorSettings, 'add' | 'remove'>>;

export function defaultGeneratorChoice(angles: string[]): GeneratorChoice {
  return {
    polynomialDegree: 2,
    angles,
    trigonometric: true,
    differences: true,
    velocityDegree: 2,
    kineticFactors: true,
    kineticPolynomialDegree: 0,
  };
}

/** Options that produce a documented family of candidate terms; "Generate terms" replaces the list. */
@Component({
  selector: 'app-generator-options',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, MatSlideToggleModule],
  template: `
    <form [formGroup]="form" (ngSubmit)="submit()" class="options">
      <mat-form-field>
        <mat-label>Coordinate powers</mat-label>
        <mat-select formControlName="polynomialDegree">
          @for (d of [0, 1, 2, 3, 4]; track d) { <mat-option [value]="d">{{ d === 0 ? 'none' : 'up to degree ' + d }}</mat-option> }
        </mat-select>
        <mat-hint>x, x², x·θ, …</mat-hint>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Angles</mat-label>
        <mat-select formControlName="angles" multiple>
          @for (c of coordinates(); track c) { <mat-option [value]="c">{{ c }}</mat-option> }
        </mat-select>
        <mat-hint>Get sines and cosines</mat-hint>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Velocity powers</mat-label>
        <mat-select formControlName="velocityDegree">
          @for (d of [2, 3, 4]; track d) { <mat-option [value]="d">up to degree {{ d }}</mat-option> }
        </mat-select>
        <mat-hint>ẋ², ẋ·θ̇, …</mat-hint>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Coordinate factors</mat-label>
        <mat-select formControlName="kineticPolynomialDegree">
          @for (d of [0, 1, 2, 3]; track d) { <mat-option [value]="d">{{ d === 0 ? 'none' : 'up to degree ' + d }}</mat-option> }
        </mat-select>
        <mat-hint>On velocity terms, such as x·ẋ²</mat-hint>
      </mat-form-field>
      <div class="toggles">
        <mat-slide-toggle formControlName="trigonometric">Sines and cosines of angles</mat-slide-toggle>
        <mat-slide-toggle formControlName="differences">Of angle differences</mat-slide-toggle>
        <mat-slide-toggle formControlName="kineticFactors">Angle factors on velocity terms</mat-slide-toggle>
      </div>
      <div class="go">
        <button mat-stroked-button type="submit" [disabled]="disabled() || coordinates().length === 0">
          <mat-icon>auto_awesome</mat-icon> Generate terms
        </button>
      </div>
    </form>
  `,
  styles: `
    .options { display: grid; grid-template-columns: repeat(4, minmax(0, 1fr)); gap: 4px 14px; align-items: start; }
    .toggles { grid-column: 1 / 4; display: flex; flex-wrap: wrap; gap: 8px 24px; padding-top: 14px; }
    .go { display: flex; justify-content: flex-end; }
    @media (max-width: 1100px) { .options { grid-template-columns: repeat(2, minmax(0, 1fr)); } .toggles { grid-column: 1 / -1; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GeneratorOptions {
  readonly coordinates = input.required<readonly string[]>();
  readonly initial = input.required<GeneratorChoice>();
  readonly disabled = input(false);
  readonly generate = output<GeneratorChoice>();

  protected readonly form = inject(FormBuilder).nonNullable.group({
    polynomialDegree: [2],
    angles: [[] as string[]],
    trigonometric: [true],
    differences: [true],
    velocityDegree: [2],
    kineticFactors: [true],
    kineticPolynomialDegree: [0],
  });

  constructor() {
    effect(() => this.form.setValue({ ...this.initial(), angles: [...this.initial().angles] }));
    effect(() => {
      const coordinates = this.coordinates();
      const angles = this.form.controls.angles.value.filter((a) => coordinates.includes(a));
      this.form.controls.angles.setValue(angles);
    });
  }

  protected submit(): void {
    this.generate.emit(this.form.getRawValue());
  }
}
