#include "ui/format.hpp"

#include <algorithm>
#include <cmath>

#include "model/result.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

using namespace units;

std::string altitude_with_unit(Length altitude, const UnitChoice& u) {
  return quantity_text(altitude, chosen_unit(kAltitudeUnits, u.altitude), 0);
}

namespace {
template <class D>
std::string in_pressure_unit(Quantity<D> p, const UnitChoice& u) {
  return quantity_text(p, chosen_unit(kPressureUnits, u.pressure),
                       kPressureDecimals[static_cast<std::size_t>(u.pressure)]);
}
}  // namespace

std::string pressure_text(Pressure pressure, const UnitChoice& u) {
  return in_pressure_unit(pressure, u);
}
std::string pressure_text(GaugePressure gauge, const UnitChoice& u) {
  return in_pressure_unit(gauge, u);
}

std::string grouped_number(double value, int decimals) {
  std::string plain = shown_number(value, decimals);
  if (!std::isfinite(value)) return plain;
  bool negative = !plain.empty() && plain[0] == '-';
  if (negative) plain.erase(0, 1);
  size_t integer_end = plain.find('.');
  if (integer_end == std::string::npos) integer_end = plain.size();
  // Groups of three split by a no-break space (SI Brochure, 9th ed. 2019, 5.4.4: a space, never
  // a dot or comma): reads the same in decimal-comma and decimal-point countries, never wraps.
  for (size_t i = integer_end; i > 3; i -= 3) plain.insert(i - 3, "\xC2\xA0");
  return negative ? "\xE2\x88\x92" + plain : plain;
}

namespace {
// Rounds toward the inside of the range (up for a low bound, down for a high one).
double round_inward(double value, bool up, int decimals) {
  if (value == 0.0 || !std::isfinite(value)) return value;
  double magnitude = std::floor(std::log10(std::fabs(value)));
  double step = std::max(std::pow(10.0, magnitude - 2.0), std::pow(10.0, -decimals));
  double scaled = value / step;
  return (up ? std::ceil(scaled - 1e-9) : std::floor(scaled + 1e-9)) * step;
}
int decimals_for(double value, int decimals) {
  for (int d = 0; d < decimals; ++d) {
    double scaled = value * std::pow(10.0, d);
    if (std::fabs(scaled - std::round(scaled)) < 1e-6) return d;
  }
  return decimals;
}
}  // namespace

std::string range_text(double low, double high, std::string_view symbol, int decimals) {
  double shown_low = round_inward(low, true, decimals);
  double shown_high = round_inward(high, false, decimals);
  std::string text = grouped_number(shown_low, decimals_for(shown_low, decimals)) + " to " +
                     grouped_number(shown_high, decimals_for(shown_high, decimals));
  if (!symbol.empty()) text += " " + std::string(symbol);
  return text;
}

}  // namespace firn::ui

namespace firn::ui {

using namespace units;

std::string cylinder_pressure_text(GaugePressure gauge, const UnitChoice& u) {
  return quantity_text(gauge, chosen_unit(kCylinderUnits, u.cylinder), 0);
}

std::string temperature_text(Temperature t, const UnitChoice& u) {
  return quantity_text(t, chosen_unit(kTemperatureUnits, u.temperature), 0);
}

std::string percent_text(Fraction f, int decimals) { return quantity_text(f, percent, decimals); }

std::string flow_text(VolumeFlow flow) { return quantity_text(flow, litres_per_minute, 1); }

std::string volume_text(Volume v) { return quantity_text(v, litres, 0); }

std::string duration_text(Duration d) {
  double total = d.in(minutes);
  if (!std::isfinite(total)) return "\xE2\x80\x94";
  long rounded = std::lround(total);
  if (rounded < 60) return std::to_string(rounded) + " min";
  return std::to_string(rounded / 60) + " h " + std::to_string(rounded % 60) + " min";
}

std::string gas_pressure_range_text(Pressure low, Pressure high, const UnitChoice& u) {
  if (u.pressure == UnitChoice::Pressure::Kilopascals) {
    return shown_number(low.in(kilopascals), 1) + "\xE2\x80\x93" + shown_number(high.in(kilopascals), 1) + " kPa";
  }
  return shown_number(low.in(mmhg), 0) + "\xE2\x80\x93" + shown_number(high.in(mmhg), 0) + " mmHg";
}

std::string gas_pressure_text(Pressure p, const UnitChoice& u) {
  if (u.pressure == UnitChoice::Pressure::Kilopascals) return shown_number(p.in(kilopascals), 1) + " kPa";
  return shown_number(p.in(mmhg), 0) + " mmHg";
}

}  // namespace firn::ui
