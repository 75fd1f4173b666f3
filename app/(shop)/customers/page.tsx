import type { Metadata } from 'next';
import Link from 'next/link';
import { CustomerForm } from '@/features/jobs/components/customer-forms';
import { listCustomers } from '@/features/jobs/server/customers';
import { searchText } from '@/features/ui/bounded';
import { EmptyState, PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'Customers' };

export default async function CustomersPage({ searchParams }: PageProps<'/customers'>) {
  const member = await requireMember('jobs.create');
  const raw = (await searchParams).q;
  // A search the database cannot take (a control character) is dropped, not a failed page.
  const parsed = searchText().safeParse(typeof raw === 'string' ? raw.slice(0, 100) : undefined);
  const q = parsed.success ? parsed.data : undefined;
  const { data, total } = await listCustomers(member.shopId, { page: 1, pageSize: 100, q });
  return (
    <>
      <PageHeader title="Customers" />
      <div className="grid gap-8 md:grid-cols-[2fr_1fr]">
        <section aria-labelledby="list-heading">
          <h2 id="list-heading" className="sr-only">
            Customer list
          </h2>
          <form role="search" className="mb-4 flex gap-2">
            <label htmlFor="q" className="sr-only">
              Search customers
            </label>
            <input
              id="q"
              name="q"
              type="search"
              defaultValue={q}
              placeholder="Name, phone or e-mail"
              className="min-h-touch border-ink-soft flex-1 rounded-lg border-2 px-3"
            />
            <button
              type="submit"
              className="min-h-touch border-ink rounded-lg border-2 px-4 font-semibold"
            >
              Search
            </button>
          </form>
          {data.length === 0 ? (
            <EmptyState title={q ? 'No customer matches' : 'No customers yet'}>
              {q
                ? 'Try part of the name or phone number.'
                : 'Add the first customer here, or while creating a job card.'}
            </EmptyState>
          ) : (
            <ul className="divide-paper-line border-paper-line divide-y-2 rounded-xl border-2">
              {data.map((c) => (
                <li key={c.id}>
                  <Link
                    href={`/customers/${c.id}`}
                    className="min-h-touch hover:bg-paper-dim flex flex-col p-3"
                  >
                    <span className="text-work font-semibold underline">{c.name}</span>
                    <span className="text-ink-soft">
                      {[c.phone, c.email].filter(Boolean).join(' · ')}
                    </span>
                  </Link>
                </li>
              ))}
            </ul>
          )}
          {total > data.length ? (
            <p className="mt-2 text-sm">
              Showing {data.length} of {total}; search to narrow.
            </p>
          ) : null}
        </section>
        <section
          aria-labelledby="add-heading"
          className="border-paper-line rounded-xl border-2 p-4"
        >
          <h2 id="add-heading" className="mb-3 text-xl font-bold">
            Add a customer
          </h2>
          <CustomerForm />
        </section>
      </div>
    </>
  );
}
