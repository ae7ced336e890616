import type { Metadata } from "next";
import { Card, PageHeading } from "@/components/ui/card";

export const metadata: Metadata = { title: "Safety around tanks and pumps" };

const CAUTIONS = [
  {
    title: "Deep water and children",
    body: "A child can drown in a few centimetres of water. Fence the tank or pond, keep a lockable cover or mesh over tanks, and never leave children alone near water.",
  },
  {
    title: "Electric pumps near water",
    body: "Power every pump and aerator through a residual-current device (RCD), keep plugs and sockets off the ground and away from splashes, and have the wiring done by a qualified electrician. Switch off before touching a pump.",
  },
  {
    title: "A tank full of water weighs tonnes",
    body: "A 6 ft × 10 ft tank filled to 1 m holds about 5.6 tonnes of water. The frame and the base must carry it: build on a level slab or well-compacted ground, keep people out of the way while filling, and let a qualified builder decide on the frame. Local building codes come first.",
  },
  {
    title: "Lifting and digging",
    body: "Sacks of feed and cement, liners and full fish crates are heavy. Lift with bent knees and a straight back, share the load, and shore up the sides of deep excavations.",
  },
];

export default function SafetyPage() {
  return (
    <div className="mx-auto max-w-3xl px-4 py-10">
      <PageHeading title="Safety around tanks and pumps" lead="The usual cautions of the trade. Follow local codes and licensed professionals where they apply; they take precedence over anything here." />
      <div className="space-y-4">
        {CAUTIONS.map((c) => (
          <Card key={c.title}>
            <h2 className="text-lg font-semibold text-silt-950">{c.title}</h2>
            <p className="mt-1 text-silt-700">{c.body}</p>
          </Card>
        ))}
      </div>
    </div>
  );
}
