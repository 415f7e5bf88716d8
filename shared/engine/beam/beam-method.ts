/** How the shaft is solved as a beam, for the method list of a result. */
export const BEAM_METHOD =
  'Euler–Bernoulli beam elements with cubic Hermite shape functions and piecewise-constant EI, a node at ' +
  'every station; rigid simple supports at the bearing centres; planes x–y and x–z solved separately; reactions from the ' +
  'unconstrained stiffness; shear and moment by statics; exact for point loads';
