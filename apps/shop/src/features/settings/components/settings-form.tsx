import { useState, type FormEvent } from 'react';
import type { SettingsView, ShopProfile } from '@benchwright/contracts';
import { ApiRequestError, Button, Field, Notice, Panel } from '@benchwright/ui';
import { useSettings, useUpdateSettings, useUploadLogo } from '../api/settings';
import { fromInput, SETTING_SECTIONS, toInput, type FieldSpec } from './sections';

type Draft = {
  profile: Record<keyof ShopProfile, string>;
  values: Record<string, string>;
  stages: Record<string, string>;
};

function draftOf(s: SettingsView): Draft {
  const values: Record<string, string> = {};
  for (const sec of SETTING_SECTIONS) for (const f of sec.fields) values[f.key] = toInput(f, s.values[f.key]);
  return {
    profile: { ...s.profile },
    values,
    stages: Object.fromEntries(s.stages.map((x) => [x.key, x.label])),
  };
}

const inputClass = (error?: string) =>
  `w-full rounded border bg-white px-3 py-2 text-ink ${error ? 'border-alert' : 'border-rule'} focus:outline-2 focus:outline-sage`;

function SettingField({
  f,
  value,
  error,
  onChange,
}: {
  f: FieldSpec;
  value: string;
  error?: string;
  onChange: (v: string) => void;
}) {
  const id = `setting-${f.key}`;
  if (f.kind === 'choice')
    return (
      <div className="mb-4">
        <label htmlFor={id} className="mb-1 block font-semibold">
          {f.label}
        </label>
        <select
          id={id}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          className={inputClass(error)}
        >
          {f.options.map(([v, label]) => (
            <option key={v} value={v}>
              {label}
            </option>
          ))}
        </select>
        {error ? (
          <p id={`${id}-error`} role="alert" className="mt-1 text-sm text-alert">
            {error}
          </p>
        ) : null}
      </div>
    );
  const unit = f.kind === 'percent' ? '%' : f.kind === 'cents' ? '$' : f.unit;
  return (
    <Field
      id={id}
      label={unit ? `${f.label} (${unit})` : f.label}
      inputMode="decimal"
      value={value}
      hint={f.hint}
      error={error}
      onChange={(e) => onChange(e.target.value)}
    />
  );
}

/** The owner's settings page: the shop, money, the shop floor, the board's stage names and capacity, saved at once. */
export function SettingsForm() {
  const settings = useSettings();
  if (settings.isPending) return <p>Loading the settings…</p>;
  if (settings.isError) return <Notice tone="error">{settings.error.message}</Notice>;
  return <Form settings={settings.data} reload={async () => (await settings.refetch()).data} />;
}

function Form({ settings, reload }: { settings: SettingsView; reload: () => Promise<SettingsView | undefined> }) {
  const [draft, setDraft] = useState(() => draftOf(settings));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string; stale?: boolean } | null>(null);
  const update = useUpdateSettings();

  const set = (part: keyof Draft, key: string, v: string) =>
    setDraft((d) => ({ ...d, [part]: { ...d[part], [key]: v } }));

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setErrors({});
    setMessage(null);
    const values: Record<string, unknown> = {};
    for (const sec of SETTING_SECTIONS)
      for (const f of sec.fields) values[f.key] = fromInput(f, draft.values[f.key] ?? '');
    try {
      const saved = await update.mutateAsync({
        version: settings.version,
        profile: draft.profile,
        values: values as never,
        stages: draft.stages,
      });
      setDraft(draftOf(saved));
      setMessage({ tone: 'ok', text: 'Settings saved. The next preview and the next revision use them.' });
    } catch (err) {
      if (err instanceof ApiRequestError && err.status === 409) {
        setMessage({
          tone: 'error',
          text: 'Someone else changed the settings since you opened this page. Reload to see their changes; yours are not saved.',
          stale: true,
        });
        return;
      }
      if (err instanceof ApiRequestError && err.issues.length) {
        setErrors(Object.fromEntries(err.issues.map((i) => [i.path, i.message])));
        setMessage({ tone: 'error', text: 'Some settings need attention; see the fields marked.' });
        return;
      }
      setMessage({ tone: 'error', text: err instanceof Error ? err.message : 'The settings could not be saved.' });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Shop settings">
      {message ? (
        <Notice tone={message.tone}>
          {message.text}{' '}
          {message.stale ? (
            <Button
              type="button"
              variant="quiet"
              onClick={async () => {
                const fresh = await reload();
                if (fresh) setDraft(draftOf(fresh));
                setErrors({});
                setMessage(null);
              }}
            >
              Reload the settings
            </Button>
          ) : null}
        </Notice>
      ) : null}
      <Panel title="The shop">
        <p className="mb-4 text-ink-soft">On the estimate, the traveler, the mail and both apps.</p>
        <Field
          label="Shop name"
          value={draft.profile.shopName}
          error={errors['profile.shopName']}
          onChange={(e) => set('profile', 'shopName', e.target.value)}
        />
        <div className="mb-4">
          <label htmlFor="shop-address" className="mb-1 block font-semibold">
            Address
          </label>
          <textarea
            id="shop-address"
            rows={3}
            value={draft.profile.address}
            aria-invalid={errors['profile.address'] ? true : undefined}
            onChange={(e) => set('profile', 'address', e.target.value)}
            className={inputClass(errors['profile.address'])}
          />
          {errors['profile.address'] ? (
            <p role="alert" className="mt-1 text-sm text-alert">
              {errors['profile.address']}
            </p>
          ) : null}
        </div>
        <Field
          label="Phone"
          type="tel"
          value={draft.profile.phone}
          error={errors['profile.phone']}
          onChange={(e) => set('profile', 'phone', e.target.value)}
        />
        <Field
          label="E-mail"
          type="email"
          value={draft.profile.email}
          error={errors['profile.email']}
          onChange={(e) => set('profile', 'email', e.target.value)}
        />
        <LogoUpload settings={settings} />
      </Panel>
      {SETTING_SECTIONS.map((sec) => (
        <Panel key={sec.id} title={sec.title}>
          <p className="mb-4 text-ink-soft">{sec.intro}</p>
          <div className="grid gap-x-6 sm:grid-cols-2">
            {sec.fields.map((f) => (
              <SettingField
                key={f.key}
                f={f}
                value={draft.values[f.key] ?? ''}
                error={errors[`values.${f.key}`]}
                onChange={(v) => set('values', f.key, v)}
              />
            ))}
          </div>
        </Panel>
      ))}
      <Panel title="The board">
        <p className="mb-4 text-ink-soft">
          The stages’ names on the board, the job page, the traveler and the timeline. The stages themselves and their
          order stay.
        </p>
        <div className="grid gap-x-6 sm:grid-cols-2">
          {settings.stages.map((s) => (
            <Field
              key={s.key}
              label={`Stage ${s.position + 1}`}
              value={draft.stages[s.key] ?? ''}
              error={errors[`stages.${s.key}`]}
              onChange={(e) => set('stages', s.key, e.target.value)}
            />
          ))}
        </div>
      </Panel>
      <Button type="submit" disabled={update.isPending}>
        {update.isPending ? 'Saving…' : 'Save the settings'}
      </Button>
    </form>
  );
}

function LogoUpload({ settings }: { settings: SettingsView }) {
  const upload = useUploadLogo();
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="mb-4">
      <p className="mb-1 font-semibold">Logo</p>
      {settings.logo ? (
        <img
          src={`/api/settings/logo?at=${encodeURIComponent(settings.updatedAt)}`}
          alt="The shop’s logo"
          className="mb-2 max-h-16 rounded border border-rule bg-white p-1"
        />
      ) : (
        <p className="mb-2 text-sm text-ink-soft">No logo yet.</p>
      )}
      <label htmlFor="shop-logo" className="mb-1 block text-sm">
        PNG, JPEG, WebP or SVG, at most 2 MB; kept as a PNG at most 600 pixels wide.
      </label>
      <input
        id="shop-logo"
        type="file"
        accept="image/png,image/jpeg,image/webp,image/svg+xml"
        aria-invalid={error ? true : undefined}
        onChange={(e) => {
          const file = e.target.files?.[0];
          if (!file) return;
          setError(null);
          upload.mutate(file, {
            onError: (err) => setError(err.message),
            onSettled: () => {
              e.target.value = '';
            },
          });
        }}
      />
      {upload.isPending ? <p className="mt-1 text-sm">Uploading…</p> : null}
      {error ? (
        <p role="alert" className="mt-1 text-sm text-alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}
