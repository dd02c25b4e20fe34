import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { TableCell, TableRow } from '@fluentui/react-components';
import { PagedTable } from './DataTable';

// Server-side rendering checks the list states without a DOM (jsdom is not installed here).
type Item = { id: string; name: string };
const render = (result: { isPending: boolean; data?: { items: Item[]; total: number } }) =>
  renderToStaticMarkup(
    createElement(PagedTable<Item>, {
      result,
      loadingLabel: 'Loading people',
      empty: createElement('p', null, 'Nobody yet'),
      label: 'People',
      columns: ['Name'],
      actionsColumn: true,
      page: 2,
      pageSize: 2,
      onPageChange: () => undefined,
      row: (item) => createElement(TableRow, { key: item.id }, createElement(TableCell, null, item.name)),
    }),
  );

describe('PagedTable', () => {
  it('shows named placeholder rows while the first page loads', () => {
    const html = render({ isPending: true });
    expect(html).toContain('aria-label="Loading people"');
    expect(html).not.toContain('<table');
  });

  it('shows the empty state, and no table or pager, when the list is empty', () => {
    const html = render({ isPending: false, data: { items: [], total: 0 } });
    expect(html).toContain('Nobody yet');
    expect(html).not.toContain('<table');
    expect(html).not.toContain('People pages');
  });

  it('shows nothing when the list failed (the caller shows the error)', () => {
    expect(render({ isPending: false })).toBe('');
  });

  it('shows the headings, a hidden actions heading, the rows and the pager of the page', () => {
    const html = render({
      isPending: false,
      data: { items: [{ id: 'c', name: 'Cleo' }], total: 3 },
    });
    expect(html).toContain('aria-label="People"');
    expect(html).toMatch(/<th[^>]*>.*Name.*<\/th>/);
    expect(html).toContain('<span class="visually-hidden">Actions</span>');
    expect(html).toContain('Cleo');
    expect(html).toContain('aria-label="People pages"');
    // Page 2 of 3 items, 2 a page: the third item alone.
    expect(html).toContain('Showing 3–3 of 3');
  });
});
