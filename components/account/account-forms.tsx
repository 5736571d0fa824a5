'use client'

import { useRouter } from 'next/navigation'
import { useState, type FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { displayNameChangeSchema, emailChangeSchema, passwordChangeSchema } from '@/lib/schemas/account'
import { useApiForm } from './use-api-form'

const buttonClass = 'self-start rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800 disabled:opacity-60'

function Outcome({ message, note }: { message: string | null; note: string | null }) {
  if (message) {
    return (
      <p role="alert" className="text-sm text-madder-700">
        {message}
      </p>
    )
  }
  if (note) {
    return (
      <p role="status" className="text-sm text-thread-800">
        {note}
      </p>
    )
  }
  return null
}

export function DisplayNameForm({ displayName }: { displayName: string }) {
  const router = useRouter()
  const [note, setNote] = useState<string | null>(null)
  const { errors, message, busy, submit } = useApiForm(
    displayNameChangeSchema,
    '/api/account',
    () => {
      setNote('Saved.')
      router.refresh()
    },
    'PATCH',
  )
  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    setNote(null)
    void submit({ displayName: new FormData(event.currentTarget).get('displayName') })
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <Field id="displayName" name="displayName" label="Your name" autoComplete="name" defaultValue={displayName} error={errors.displayName} />
      <Outcome message={message} note={note} />
      <button type="submit" disabled={busy} className={buttonClass}>
        {busy ? 'Saving…' : 'Save the name'}
      </button>
    </form>
  )
}

export function EmailChangeForm({ email }: { email: string }) {
  const [note, setNote] = useState<string | null>(null)
  const { errors, message, busy, submit } = useApiForm(emailChangeSchema, '/api/account/email', (_values, answer) =>
    setNote(typeof answer.message === 'string' ? answer.message : 'Check the new address for a link.'),
  )
  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    setNote(null)
    const form = new FormData(event.currentTarget)
    void submit({ newEmail: form.get('newEmail'), currentPassword: form.get('currentPassword') })
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <p className="text-sm text-stone-600">
        Now: <strong>{email}</strong>
      </p>
      <Field id="newEmail" name="newEmail" type="email" label="New e-mail address" autoComplete="email" error={errors.newEmail} />
      <Field id="emailCurrentPassword" name="currentPassword" type="password" label="Current password" autoComplete="current-password" error={errors.currentPassword} />
      <Outcome message={message} note={note} />
      <button type="submit" disabled={busy} className={buttonClass}>
        {busy ? 'Sending…' : 'Change the address'}
      </button>
    </form>
  )
}

export function PasswordChangeForm() {
  const router = useRouter()
  const [note, setNote] = useState<string | null>(null)
  const { errors, message, busy, submit } = useApiForm(passwordChangeSchema, '/api/account/password', (_values, answer) => {
    const ended = typeof answer.endedSessions === 'number' ? answer.endedSessions : 0
    setNote(`Password changed. ${ended === 1 ? 'One other browser was' : `${ended} other browsers were`} signed out.`)
    router.refresh()
  })
  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    setNote(null)
    const form = event.currentTarget
    const data = new FormData(form)
    void submit({ currentPassword: data.get('currentPassword'), newPassword: data.get('newPassword') }).then(() => form.reset())
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <Field id="currentPassword" name="currentPassword" type="password" label="Current password" autoComplete="current-password" error={errors.currentPassword} />
      <Field id="newPassword" name="newPassword" type="password" label="New password (at least 10 characters)" autoComplete="new-password" error={errors.newPassword} />
      <Outcome message={message} note={note} />
      <button type="submit" disabled={busy} className={buttonClass}>
        {busy ? 'Saving…' : 'Change the password'}
      </button>
    </form>
  )
}
