import { describe, expect, it } from "vitest";
import { MAX_DRAWING_BYTES } from "../../shared/schemas/order";
import { drawingProblem, fileSize } from "../../src/features/ordering/drawing-check";

describe("a drawing chosen for an order, before it is sent", () => {
  it("takes PDF, DXF, STEP and images of a sensible size", () => {
    for (const name of ["can.pdf", "Flat.DXF", "model.step", "model.stp", "photo.jpeg", "scan.tif", "a.png", "b.webp"]) expect(drawingProblem({ name, size: 1000 })).toBeNull();
  });

  it("names the file and what is wrong: the kind, an empty file, one over the limit", () => {
    expect(drawingProblem({ name: "setup.exe", size: 10 })).toMatch(/^setup\.exe: send PDF, DXF, STEP/);
    expect(drawingProblem({ name: "README", size: 10 })).toMatch(/send PDF/);
    expect(drawingProblem({ name: "empty.pdf", size: 0 })).toBe("empty.pdf is empty.");
    expect(drawingProblem({ name: "big.pdf", size: MAX_DRAWING_BYTES + 1 })).toBe("big.pdf is 20.0 MB; at most 20.0 MB a file.");
    expect(drawingProblem({ name: "edge.pdf", size: MAX_DRAWING_BYTES })).toBeNull();
  });

  it("writes sizes as people read them", () => {
    expect(fileSize(300)).toBe("1 kB");
    expect(fileSize(150 * 1024)).toBe("150 kB");
    expect(fileSize(3.5 * 1024 * 1024)).toBe("3.5 MB");
  });
});
