import type { Metadata } from 'next'
import Link from 'next/link'
import { Pager } from '@/components/admin/pager'
import { UserActions } from '@/components/admin/user-actions'
import { UserState } from '@/components/admin/user-state'
import { USER_FILTERS, userListQuerySchema, type UserListQuery, type UserSort } from '@/lib/schemas/admin'
import { listUsers } from '@/lib/services/admin'
import { deskTitle, requireAdmin } from '../../admin-guard'

export const generateMetadata = (): Promise<Metadata> => deskTitle('People')

type SearchParams = Promise<Record<string, string | string[] | undefined>>

/** The address of this page with the given search, sort and page. */
function hrefFor(query: UserListQuery): string {
  const search = new URLSearchParams()
  if (query.q) search.set('q', query.q)
  if (query.filter !== 'all') search.set('filter', query.filter)
  if (query.sort !== '-joined') search.set('sort', query.sort)
  if (query.page > 1) search.set('page', String(query.page))
  const text = search.toString()
  return text ? `/admin/users?${text}` : '/admin/users'
}

const FILTER_LABELS: Record<UserListQuery['filter'], string> = {
  all: 'Everyone',
  disabled: 'Disabled',
  unverified: 'Unverified',
  'designer-request': 'Asking to design',
}

const COLUMNS: { key: 'name' | 'email' | 'joined'; label: string }[] = [
  { key: 'name', label: 'Name' },
  { key: 'email', label: 'E-mail' },
  { key: 'joined', label: 'Joined' },
]

/** A column heading that sorts by it, and the other way round when it already does. */
function SortHeading({ column, query }: { column: (typeof COLUMNS)[number]; query: UserListQuery }) {
  const ascending = query.sort === column.key
  const descending = query.sort === `-${column.key}`
  const next = (ascending ? `-${column.key}` : column.key) as UserSort
  return (
    <th scope="col" aria-sort={ascending ? 'ascending' : descending ? 'descending' : undefined} className="px-2 py-2 text-left">
      <Link href={hrefFor({ ...query, sort: next, page: 1 })} className="hover:text-thread-700">
        {column.label} {ascending ? '▲' : descending ? '▼' : ''}
      </Link>
    </th>
  )
}

export default async function AdminUsersPage({ searchParams }: { searchParams: SearchParams }) {
  const admin = await requireAdmin('manage-users')
  const raw = Object.fromEntries(Object.entries(await searchParams).map(([name, value]) => [name, Array.isArray(value) ? value[0] : value]))
  const parsed = userListQuerySchema.safeParse(raw)
  const query = parsed.success ? parsed.data : userListQuerySchema.parse({})
  const users = await listUsers(admin, query)
  return (
    <section className="space-y-4">
      <h1 className="text-2xl font-semibold text-thread-800">People</h1>
      <form method="get" action="/admin/users" role="search" className="flex items-end gap-2">
        <div className="flex flex-col gap-1">
          <label htmlFor="user-search" className="text-sm font-medium text-stone-700">
            Find by name or e-mail
          </label>
          <input id="user-search" name="q" type="search" defaultValue={query.q} className="w-80 rounded border border-stone-300 bg-white px-3 py-2" />
        </div>
        {query.sort !== '-joined' && <input type="hidden" name="sort" value={query.sort} />}
        {query.filter !== 'all' && <input type="hidden" name="filter" value={query.filter} />}
        <button type="submit" className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
          Search
        </button>
      </form>
      <nav aria-label="Show" className="flex flex-wrap gap-2 text-sm">
        {USER_FILTERS.map((filter) => (
          <Link
            key={filter}
            href={hrefFor({ ...query, filter, page: 1 })}
            aria-current={query.filter === filter ? 'page' : undefined}
            className={`rounded-full border px-3 py-1 ${query.filter === filter ? 'border-thread-700 bg-thread-700 text-white' : 'border-stone-300 hover:bg-linen-100'}`}
          >
            {FILTER_LABELS[filter]}
          </Link>
        ))}
      </nav>
      {!parsed.success && <p className="text-sm text-madder-700">That address held a search the desk could not read; showing everyone instead.</p>}
      <table className="w-full border-collapse text-sm">
        <thead className="border-b border-linen-200 text-stone-600">
          <tr>
            {COLUMNS.map((column) => (
              <SortHeading key={column.key} column={column} query={query} />
            ))}
            <th scope="col" className="px-2 py-2 text-left">Roles</th>
            <th scope="col" className="px-2 py-2 text-left">State</th>
            <th scope="col" className="px-2 py-2 text-left">Change</th>
          </tr>
        </thead>
        <tbody>
          {users.rows.map((user) => (
            <tr key={user.id} className="border-b border-linen-100 align-top" data-testid="user-row">
              <td className="px-2 py-2 font-medium">{user.displayName}</td>
              <td className="px-2 py-2">{user.email}</td>
              <td className="px-2 py-2 whitespace-nowrap">{user.joinedAt.slice(0, 10)}</td>
              <td className="px-2 py-2" data-testid="user-roles">{user.roles.join(', ')}</td>
              <td className="px-2 py-2">
                <UserState user={user} />
              </td>
              <td className="px-2 py-2">
                <UserActions user={user} isSelf={user.id === admin.id} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {users.rows.length === 0 && <p className="text-stone-600">Nobody matches.</p>}
      <Pager page={users.page} pageCount={users.pageCount} total={users.total} noun="people" hrefFor={(page) => hrefFor({ ...query, page })} />
    </section>
  )
}
