import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { inlineMarkdown } from '../../format/inline-markdown';

/**
 * Text from the API description with its inline markup shown as elements, never as raw HTML. A plain run
 * sits in an ng-container so the template's own line breaks do not become spaces around it ("`x`." must
 * not read "x .").
 */
@Component({
  selector: 'iso-rich-text',
  template: `@for (run of runs(); track $index) {
    @switch (run.kind) {
      @case ('code') {
        <code>{{ run.text }}</code>
      }
      @case ('em') {
        <em>{{ run.text }}</em>
      }
      @case ('strong') {
        <strong>{{ run.text }}</strong>
      }
      @case ('link') {
        <a [href]="run.href">{{ run.text }}</a>
      }
      @default {
        <ng-container>{{ run.text }}</ng-container>
      }
    }
  }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RichText {
  readonly text = input.required<string>();
  protected readonly runs = computed(() => inlineMarkdown(this.text()));
}
