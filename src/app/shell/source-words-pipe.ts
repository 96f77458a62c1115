import { Pipe, type PipeTransform } from '@angular/core';
import { sourceWords } from './user-words';

/** `{{ material.source | sourceWords }}`: where a value comes from, in the user's words (user-words.ts). */
@Pipe({ name: 'sourceWords' })
export class SourceWordsPipe implements PipeTransform {
  transform(text: string | null | undefined): string {
    return text ? sourceWords(text) : '';
  }
}
