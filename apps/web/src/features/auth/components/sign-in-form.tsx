import { loginBodySchema, type LoginBody } from "@ringdown/contracts";
import { Button } from "@/components/ui/button";
import { PasswordField, TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { useSignIn } from "../api/sign-in";

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  return (
    <Form
      schema={loginBodySchema}
      defaultValues={{ email: "", password: "" }}
      onSubmit={async (values: LoginBody) => {
        await signIn.mutateAsync(values);
        onSignedIn();
      }}
      aria-label="Sign in"
      className="flex flex-col gap-4"
    >
      {({ formState }) => (
        <>
          <FormError />
          <TextField name="email" label="E-mail" type="email" autoComplete="username" inputMode="email" autoFocus />
          <PasswordField name="password" label="Password" autoComplete="current-password" />
          <Button type="submit" pending={formState.isSubmitting} className="mt-1 w-full">
            Sign in
          </Button>
        </>
      )}
    </Form>
  );
}
