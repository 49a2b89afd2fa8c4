import { fireEvent, render, screen } from "@testing-library/react";
import { useState } from "react";
import { describe, expect, it } from "vitest";
import { Stepper } from "@/components/field/stepper";

function Harness({ start = 1 }: { start?: number }) {
  const [value, setValue] = useState(start);
  return <Stepper label="Count" value={value} onChange={setValue} />;
}

describe("count stepper", () => {
  it("counts up and down with its buttons and never goes below zero", () => {
    render(<Harness start={1} />);
    const input = screen.getByRole("spinbutton", { name: "Count" });
    fireEvent.click(screen.getByRole("button", { name: "More (Count)" }));
    fireEvent.click(screen.getByRole("button", { name: "More (Count)" }));
    expect(input).toHaveValue(3);
    for (let i = 0; i < 5; i++) fireEvent.click(screen.getByRole("button", { name: "Fewer (Count)" }));
    expect(input).toHaveValue(0);
    expect(screen.getByRole("button", { name: "Fewer (Count)" })).toBeDisabled();
  });

  it("accepts a typed number and rounds it to a whole count", () => {
    render(<Harness />);
    const input = screen.getByRole("spinbutton", { name: "Count" });
    fireEvent.change(input, { target: { value: "12.6" } });
    expect(input).toHaveValue(13);
  });
});
