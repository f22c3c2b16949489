#include <iostream>

#include "plugin/cli/app.h"

int main(int argc, char** argv) { return ergpath::cli::run(argc, argv, std::cout, std::cerr); }
