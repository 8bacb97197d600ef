//! Properties at a pressure and temperature anywhere in IAPWS-IF97: the
//! region is chosen by [`super::regions::region_pt`] and the properties come
//! from that region's equation.

use super::{region1, region2, region3, region5, regions, FormulationError, Properties, Region};

/// The properties at pressure p (Pa) and temperature T (K), with the region
/// they were computed in.
///
/// Range: the whole of IAPWS-IF97, 273.15 K ≤ T ≤ 1073.15 K for
/// 0 < p ≤ 100 MPa and 1073.15 K < T ≤ 2273.15 K for 0 < p ≤ 50 MPa. On the
/// saturation line (p = psat(T) below 623.15 K) the saturated liquid of
/// Region 1 is returned, as `region_pt` decides; use
/// [`super::saturation`] for both saturated states. Region 3 uses the
/// bracketed density solver of [`region3::density_pt`] (not the 2005
/// backward equations). Accuracy: that of the region equations themselves.
///
/// # Errors
/// Those of `region_pt` ([`FormulationError::NotFinite`],
/// [`FormulationError::PressureOutOfRange`],
/// [`FormulationError::TemperatureOutOfRange`],
/// [`FormulationError::OutsideFormulation`]) and of the region functions.
///
/// # Example
/// ```
/// use vapora_tables::if97::{pt, Region};
/// let (steam, region) = pt::properties_pt_with_region(10.0e6, 773.15)?;
/// assert_eq!(region, Region::Region2);
/// assert!((steam.enthalpy_j_kg - 3.3759e6).abs() < 1e3);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
pub fn properties_pt_with_region(
    pressure_pa: f64,
    temperature_k: f64,
) -> Result<(Properties, Region), FormulationError> {
    let region = regions::region_pt(pressure_pa, temperature_k)?;
    let props = match region {
        Region::Region1 => region1::properties(pressure_pa, temperature_k)?,
        Region::Region2 => region2::properties(pressure_pa, temperature_k)?,
        Region::Region3 => region3::properties_pt(pressure_pa, temperature_k)?,
        Region::Region5 => region5::properties(pressure_pa, temperature_k)?,
        // region_pt never answers Region 4 for a (p, T) pair.
        Region::Region4 => {
            return Err(FormulationError::OutsideFormulation {
                pressure_pa,
                temperature_k,
            })
        }
    };
    Ok((props, region))
}

/// The properties at pressure p (Pa) and temperature T (K) anywhere in
/// IAPWS-IF97 (see [`properties_pt_with_region`] for range and method).
///
/// # Errors
/// As [`properties_pt_with_region`].
///
/// # Example
/// ```
/// use vapora_tables::if97::pt;
/// let water = pt::properties_pt(3.0e6, 300.0)?; // IAPWS R7-97(2012) Table 5 point
/// assert!((water.specific_volume_m3_kg - 0.100215168e-2).abs() < 1e-11);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
pub fn properties_pt(pressure_pa: f64, temperature_k: f64) -> Result<Properties, FormulationError> {
    properties_pt_with_region(pressure_pa, temperature_k).map(|(props, _)| props)
}
