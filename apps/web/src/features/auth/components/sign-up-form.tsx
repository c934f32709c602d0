import { signupBodySchema, type SignupBody } from "@ringdown/contracts";
import { Button } from "@/components/ui/button";
import { PasswordField, TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { useSignUp } from "../api/sign-up";

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const signUp = useSignUp();
  return (
    <Form
      schema={signupBodySchema}
      defaultValues={{ name: "", email: "", password: "", shopName: "" }}
      onSubmit={async (values: SignupBody) => {
        await signUp.mutateAsync(values);
        onSignedUp();
      }}
      aria-label="Create an account"
      className="flex flex-col gap-4"
    >
      {({ formState }) => (
        <>
          <FormError />
          <TextField name="name" label="Your name" autoComplete="name" autoFocus />
          <TextField name="email" label="E-mail" type="email" autoComplete="email" inputMode="email" />
          <PasswordField name="password" label="Password" autoComplete="new-password" hint="At least 10 characters." />
          <TextField
            name="shopName"
            label="Shop name"
            autoComplete="organization"
            hint="Your first shop; you will be its owner. You can add more shops later."
          />
          <Button type="submit" pending={formState.isSubmitting} className="mt-1 w-full">
            Create account and shop
          </Button>
        </>
      )}
    </Form>
  );
}
