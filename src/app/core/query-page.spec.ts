import { HttpErrorResponse } from '@angular/common/http';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject, type Observable } from 'rxjs';
import type { Page } from './api-types';
import { queryPage } from './query-page';

function setUp() {
  const query = signal<{ wid: number | null; pageIndex: number }>({ wid: null, pageIndex: 0 });
  const asked: Array<{ wid: number; pageIndex: number; answer: Subject<Page<string>> }> = [];
  const fetch = (q: { wid: number | null; pageIndex: number }): Observable<Page<string>> | null => {
    if (q.wid === null) return null;
    const answer = new Subject<Page<string>>();
    asked.push({ wid: q.wid, pageIndex: q.pageIndex, answer });
    return answer;
  };
  const list = TestBed.runInInjectionContext(() => queryPage(query, fetch));
  TestBed.tick();
  return { query, asked, list };
}

describe('queryPage', () => {
  it('gives an empty page, not loading, while there is nothing to ask', () => {
    const { asked, list } = setUp();
    expect(asked).toHaveLength(0);
    expect(list.page()).toEqual({ items: [], total: 0 });
    expect(list.loading()).toBe(false);
  });

  it('asks again when the query changes and keeps only the latest answer', () => {
    const { query, asked, list } = setUp();
    query.set({ wid: 1, pageIndex: 0 });
    TestBed.tick();
    query.set({ wid: 1, pageIndex: 1 });
    TestBed.tick();
    expect(asked.map((a) => a.pageIndex)).toEqual([0, 1]);
    expect(list.loading()).toBe(true);
    asked[0].answer.next({ items: ['old'], total: 40 });
    expect(list.page().items).toEqual([]);
    asked[1].answer.next({ items: ['b'], total: 40 });
    expect(list.page()).toEqual({ items: ['b'], total: 40 });
    expect(list.loading()).toBe(false);
  });

  it('says why a request failed, with an empty page, and clears it on the next', () => {
    const { query, asked, list } = setUp();
    query.set({ wid: 1, pageIndex: 0 });
    TestBed.tick();
    asked[0].answer.error(new HttpErrorResponse({ status: 403 }));
    expect(list.error()).toMatch(/role/);
    expect(list.page()).toEqual({ items: [], total: 0 });
    expect(list.loading()).toBe(false);
    query.set({ wid: 2, pageIndex: 0 });
    TestBed.tick();
    expect(list.error()).toBeNull();
    expect(list.loading()).toBe(true);
  });
});
