import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { profileSchema } from "../../../shared/schemas/auth";
import { useUpdateProfile, type User } from "../../api/auth";
import { useServerErrors } from "../../lib/use-server-errors";
import { roleLabels } from "../../lib/roles";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";

export function ProfileForm({ user }: { user: User }) {
  const [saved, setSaved] = useState(false);
  const update = useUpdateProfile();
  const { register, handleSubmit, setError, reset, formState } = useForm({
    resolver: zodResolver(profileSchema),
    defaultValues: { name: user.name },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["name"]);

  const onSubmit = handleSubmit(async (values) => {
    setSaved(false);
    clearFormMessage();
    try {
      const { user: updated } = await update.mutateAsync(values);
      reset({ name: updated.name });
      setSaved(true);
    } catch (error) {
      showServerError(error);
    }
  });

  const { errors, isSubmitting, isDirty } = formState;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <dt className="font-semibold text-flux-700">Email</dt>
        <dd className="break-all font-mono">{user.email}</dd>
        <dt className="font-semibold text-flux-700">Role</dt>
        <dd>{roleLabels[user.role]}</dd>
        {user.organizationName && (
          <>
            <dt className="font-semibold text-flux-700">Organisation</dt>
            <dd>{user.organizationName}</dd>
          </>
        )}
      </dl>
      {formMessage && (
        <StatusNote tone="danger" live="assertive">
          {formMessage}
        </StatusNote>
      )}
      <TextField label="Name" autoComplete="name" error={errors.name?.message} {...register("name")} />
      <Button type="submit" pending={isSubmitting} pendingLabel="Saving…" disabled={!isDirty}>
        Save name
      </Button>
      {/* beside the button the person just pressed */}
      {saved && !isDirty && <StatusNote tone="ok" word="Saved" live="polite">Your name is updated.</StatusNote>}
    </form>
  );
}
