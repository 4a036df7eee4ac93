import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { inlineMarkdown } from '../../format/inline-markdown';

/** Text from the API description with its inline markup shown as elements, never as raw HTML. */
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
        {{ run.text }}
      }
    }
  }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RichText {
  readonly text = input.required<string>();
  protected readonly runs = computed(() => inlineMarkdown(this.text()));
}
