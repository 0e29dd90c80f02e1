#include "ui/format.hpp"

#include "model/result.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

using namespace units;

std::string_view altitude_unit_symbol(const UnitChoice& u) {
  return u.altitude == UnitChoice::Altitude::Feet ? feet.symbol : metres.symbol;
}

std::string_view pressure_unit_symbol(const UnitChoice& u) {
  switch (u.pressure) {
    case UnitChoice::Pressure::Millimetres: return mmhg.symbol;
    case UnitChoice::Pressure::Kilopascals: return kilopascals.symbol;
    case UnitChoice::Pressure::InchesHg: return inhg.symbol;
    case UnitChoice::Pressure::Hectopascals: break;
  }
  return hectopascals.symbol;
}

std::string altitude_text(Length altitude, const UnitChoice& u) {
  double value = u.altitude == UnitChoice::Altitude::Feet ? altitude.in(feet) : altitude.in(metres);
  // Up to 2 decimals so a value typed in the other unit survives the round trip on screen.
  return format_number(value, 2);
}

std::string altitude_with_unit(Length altitude, const UnitChoice& u) {
  double value = u.altitude == UnitChoice::Altitude::Feet ? altitude.in(feet) : altitude.in(metres);
  return shown_number(value, 0) + " " + std::string(altitude_unit_symbol(u));
}

std::string pressure_text(Pressure pressure, const UnitChoice& u) {
  switch (u.pressure) {
    case UnitChoice::Pressure::Millimetres:
      return shown_number(pressure.in(mmhg), 1) + " mmHg";
    case UnitChoice::Pressure::Kilopascals:
      return shown_number(pressure.in(kilopascals), 2) + " kPa";
    case UnitChoice::Pressure::InchesHg:
      return shown_number(pressure.in(inhg), 2) + " inHg";
    case UnitChoice::Pressure::Hectopascals: break;
  }
  return shown_number(pressure.in(hectopascals), 1) + " hPa";
}

}  // namespace firn::ui
