/** The standing caution shown on every screen. */
export function Caution() {
  return (
    <p className="caution" role="note">
      Osmocount is a checking aid, not a prescriber. Figures are calculated estimates from the catalog’s
      stock compositions; measured osmolality of concentrated PN runs higher. Local policy and the
      verifying pharmacist decide. PN is a high-alert medication.
    </p>
  );
}
