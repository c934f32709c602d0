import { createShopBodySchema, type CreateShopBody } from "@ringdown/contracts";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { useCreateShop } from "../api/create-shop";

export function NewShopDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const createShop = useCreateShop();
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="New shop"
      description="You will be the new shop's owner, and it becomes your active shop. Its cutters, machines and recipes are kept apart from your other shops."
    >
      <Form
        schema={createShopBodySchema}
        defaultValues={{ name: "" }}
        onSubmit={async (values: CreateShopBody) => {
          await createShop.mutateAsync(values);
          onClose();
        }}
        className="flex flex-col gap-4"
      >
        {({ formState }) => (
          <>
            <FormError />
            <TextField name="name" label="Shop name" autoComplete="organization" autoFocus />
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" pending={formState.isSubmitting}>
                Create shop
              </Button>
            </div>
          </>
        )}
      </Form>
    </Dialog>
  );
}
